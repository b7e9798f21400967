import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { Db } from '../db/client';
import { HttpError } from '../http-errors';
import { currentUser, requireUser } from '../auth/current-user';
import { accessOf, type RequireProjectRole } from '../authz/project-access';
import { validateSheet } from '../sheets/validate-sheet';
import { TitleSchema } from './schemas';
import { createProject } from './repo';
import { presentProject } from './present';

/** Largest sheet file accepted for import, bytes. */
export const MAX_SHEET_FILE_BYTES = 1024 * 1024;

// File names arrive as raw UTF-8 from browsers; busboy would read them as latin1 (mojibake).
const upload = multer({ storage: multer.memoryStorage(), defParamCharset: 'utf8', limits: { fileSize: MAX_SHEET_FILE_BYTES, files: 1, fields: 4, fieldSize: 1024 } });

// multer's own errors become our JSON errors with a hint.
const receiveFile: RequestHandler = (req, res, next) => {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, 'file_too_large', `The file is larger than ${MAX_SHEET_FILE_BYTES / 1024} kB; a sheet file is far smaller. Is it the right file?`, 'file'));
      return next(new HttpError(400, 'bad_upload', `The upload was not accepted (${err.message}). Send one file in the form field "file".`, err.field ?? 'file'));
    }
    next(new HttpError(400, 'bad_upload', 'The upload could not be read. Send multipart/form-data with one file in the field "file".', 'file'));
  });
};

const printable = (text: string) => [...text].map((ch) => (ch.charCodeAt(0) < 0x20 || ch.charCodeAt(0) === 0x7f ? ' ' : ch)).join('');

function fileTitle(name: string): string {
  return printable(name.replace(/\.(tapline\.)?json$/i, '')).trim().slice(0, 120);
}

/** A client-chosen file name as it may appear in a message: one line, not too long. */
function shownName(name: string): string {
  const one = printable(name);
  return one.length > 80 ? `${one.slice(0, 80)}…` : one;
}

/** A file name the browser will save under, made of the title's letters and digits. */
export function exportFileName(title: string): string {
  const slug = title.normalize('NFKD').replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60).toLowerCase();
  return `${slug || 'sheet'}.tapline.json`;
}

/** `POST /api/projects/import` (multipart field "file", optional "title") and `GET /api/projects/:id/export`. */
export function importExportRouter(db: Db, requireProjectRole: RequireProjectRole): Router {
  const r = Router();

  r.post('/projects/import', requireUser, receiveFile, async (req, res) => {
    const unknown = Object.keys(req.body ?? {}).find((k) => k !== 'title');
    if (unknown !== undefined) throw new HttpError(400, 'invalid_request', `Form field "${unknown.slice(0, 64)}" is not one this route takes: send "file" and optionally "title".`, unknown.slice(0, 64));
    const file = req.file;
    if (!file) throw new HttpError(400, 'file_missing', 'No file was sent. Choose a .tapline.json sheet file and send it in the form field "file".', 'file');
    let data: unknown;
    try {
      data = JSON.parse(file.buffer.toString('utf8').replace(/^\uFEFF/, ''));
    } catch (e) {
      throw new HttpError(400, 'invalid_file', `"${shownName(file.originalname)}" is not a JSON file (${(e as Error).message}). Export a sheet from Tapline and import that file.`, 'file');
    }
    const sheet = validateSheet(data, 'file');
    const rawTitle = typeof req.body?.title === 'string' && req.body.title.trim() ? req.body.title
      : typeof sheet.title === 'string' && sheet.title.trim() ? sheet.title
        : fileTitle(file.originalname) || 'Imported sheet';
    const title = TitleSchema.safeParse(rawTitle);
    if (!title.success) throw new HttpError(400, 'invalid_request', `The title "${String(rawTitle).slice(0, 40)}" cannot be used: ${title.error.issues[0].message}.`, 'title');
    const user = currentUser(req);
    const p = await createProject(db, user.id, title.data, sheet);
    res.status(201).location(`/api/projects/${p.id}`).json(presentProject(p, 'owner', { id: user.id, login: user.login, name: user.name }));
  });

  r.get('/projects/:id/export', requireProjectRole('viewer'), (req, res) => {
    const { project } = accessOf(req);
    const sheet = project.sheet as Record<string, unknown>;
    const body = JSON.stringify({ ...sheet, title: typeof sheet.title === 'string' && sheet.title ? sheet.title : project.title }, null, 2);
    res.setHeader('Content-Disposition', `attachment; filename="${exportFileName(project.title)}"`);
    res.type('application/json').send(body + '\n');
  });

  return r;
}
