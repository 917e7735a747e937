import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { route, type RouteDef } from '../routing.js';
import { pageQuery, uuidParam } from '../../shared/schemas/common.js';
import type { Deps } from '../deps.js';
import { notFound } from '../errors.js';
import { findMailLog, listMailLog } from './mail.repository.js';

/** The outbox page: lets a demo be followed without a mail client. */
export function mailRoutes({ db, config }: Deps): RouteDef[] {
  return [
    route({
      method: 'get', path: '/mail', access: ['read', 'MailLog'], query: pageQuery,
      handler: async ({ query }) => {
        const { items, total } = await listMailLog(db, query.page, query.pageSize);
        return { items, total, page: query.page, pageSize: query.pageSize };
      },
    }),
    route({
      method: 'get', path: '/mail/:id', access: ['read', 'MailLog'], params: uuidParam,
      handler: async ({ params }) => {
        const row = await findMailLog(db, params.id);
        if (!row) throw notFound('That message');
        const raw = row.fileName ? await readFile(path.join(config.mail.outboxDir, path.basename(row.fileName)), 'utf8').catch(() => null) : null;
        return { ...row, raw };
      },
    }),
  ];
}
