import { useQueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { bindCloudQueryClient } from '../cloud/registerCloudSources';
import { cloudPaths } from '../cloud/routeIds';
import { SheetPage } from './SheetPage';

/**
 * `/projects/:id`: the same editor page as `/sheets/:id`, on the cloud sheet source (the resolver
 * in src/cloud/registerCloudSources.ts recognises the project's UUID), with a link to settings.
 */
export function CloudSheetPage() {
  bindCloudQueryClient(useQueryClient());
  const { id = '' } = useParams();
  return (
    <div className="flex h-full flex-col">
      <nav aria-label="Project" className="flex shrink-0 items-center gap-3 border-b border-rule bg-sunken px-4 py-1 text-sm">
        <Link className="text-accent hover:underline" to="/projects">Projects</Link>
        <span aria-hidden="true">/</span>
        <Link className="text-accent hover:underline" to={cloudPaths.settings(id)}>Members, revisions and sharing</Link>
      </nav>
      <div className="min-h-0 flex-1"><SheetPage /></div>
    </div>
  );
}
