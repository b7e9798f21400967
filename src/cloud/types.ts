// Shapes of the server's answers (see server/*/routes.ts and shared/contracts/service-api.md).

export type Role = 'viewer' | 'editor' | 'owner';
export const ROLES: readonly Role[] = ['viewer', 'editor', 'owner'];

const RANK: Record<Role, number> = { viewer: 1, editor: 2, owner: 3 };
/** Viewers read and solve; editors also change the sheet; owners also manage the project. */
export function roleAtLeast(role: Role | undefined, needed: Role): boolean {
  return role !== undefined && RANK[role] >= RANK[needed];
}

export interface Me {
  id: number;
  login: string;
  name: string | null;
  email: string | null;
  avatarUrl: string | null;
}

export interface PersonRef {
  login: string;
  name: string | null;
}

export interface ProjectSummary {
  id: string;
  title: string;
  role: Role;
  version: number;
  createdAt: string;
  updatedAt: string;
  updatedBy: PersonRef | null;
  memberCount: number;
  partCount: number;
}

export interface ProjectDetail {
  id: string;
  title: string;
  role: Role;
  version: number;
  sheet: unknown;
  createdAt: string;
  updatedAt: string;
  updatedBy: (PersonRef & { id: number }) | null;
  /** owners only */
  share?: { enabled: boolean; token: string | null };
}

export interface Member {
  userId: number;
  login: string;
  name: string | null;
  avatarUrl: string | null;
  role: Role;
  joinedAt: string;
}

export interface PendingInvitation {
  id: string;
  email: string;
  role: Role;
  createdAt: string;
  expiresAt: string;
}

export interface InvitationInfo {
  projectTitle: string;
  role: Role;
  email: string;
  invitedBy: PersonRef | null;
  expiresAt: string;
  status: 'pending' | 'accepted' | 'expired';
}

export interface RevisionSummary {
  id: string;
  label: string;
  kind: 'named' | 'restore' | 'auto';
  projectVersion: number;
  restoredFrom: string | null;
  createdAt: string;
  createdBy: PersonRef | null;
}

export interface RevisionDetail extends RevisionSummary {
  sheet: unknown;
}

export interface SharedSheet {
  title: string;
  sheet: unknown;
  version: number;
  updatedAt: string;
  readOnly: true;
}
