import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { pino, type Logger, type DestinationStream } from 'pino';
import { pinoHttp } from 'pino-http';
import pretty from 'pino-pretty';

export type { Logger };

export interface LogOptions {
  level: string;
  format: 'json' | 'pretty';
}

// Whatever a request carries that could let someone act as another person never reaches a log line.
const REDACT = [
  'req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]',
  '*.password', '*.currentPassword', '*.newPassword', '*.token', '*.sessionSecret', '*.smtpUrl',
];

/** One logger per process: JSON lines in production (LOG_FORMAT=json), readable lines at a terminal. */
export function createLogger(opts: LogOptions, destination?: DestinationStream): Logger {
  const base = { level: opts.level, redact: { paths: REDACT, censor: '[hidden]' }, base: { pid: process.pid } };
  if (destination) return pino(base, destination);
  if (opts.format === 'json') return pino(base);
  return pino(base, pretty({ colorize: process.stdout.isTTY, sync: true, ignore: 'pid,hostname', translateTime: 'SYS:HH:MM:ss.l' }));
}

// A caller's own request id is kept when it is short and plain, so a proxy's id follows the request.
const OWN_ID = /^[A-Za-z0-9._-]{8,64}$/;

/** Links (set-password, verification) carry secrets in the query string: they are cut from logged URLs. */
export function scrubUrl(url: string): string {
  return url.replace(/([?&](?:token|code)=)[^&#]*/gi, '$1[hidden]');
}

/** One log line per request, with an id that the response and any error body carry too. */
export function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: (req: IncomingMessage, res: ServerResponse) => {
      const given = req.headers['x-request-id'];
      const id = typeof given === 'string' && OWN_ID.test(given) ? given : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    // A 503 while the database is away is expected and logged once as an outage; a warning per request is enough.
    customLogLevel: (_req, res, err) => (res.statusCode === 503 ? 'warn' : err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    customSuccessMessage: (req, res, ms) => `${req.method} ${scrubUrl(req.url ?? '')} ${res.statusCode} ${Math.round(ms)} ms`,
    customErrorMessage: (req, res) => `${req.method} ${scrubUrl(req.url ?? '')} ${res.statusCode}`,
    serializers: {
      req: (req: { id: unknown; method: string; url: string; remoteAddress?: string }) => ({ id: req.id, method: req.method, url: scrubUrl(req.url), remoteAddress: req.remoteAddress }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    autoLogging: { ignore: (req) => req.url === '/api/live' },
  });
}
