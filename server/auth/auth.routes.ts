import { z } from 'zod';
import { route, type RouteDef } from '../routing.js';
import { changePasswordBody, forgotPasswordBody, setPasswordBody, signInBody } from '../../shared/schemas/auth.js';
import { unauthorized } from '../errors.js';
import type { AuthService } from './auth.service.js';

const tokenQuery = z.object({ token: z.string().min(20, 'the link is incomplete').max(200) });

export function authRoutes(auth: AuthService): RouteDef[] {
  return [
    route({
      method: 'post', path: '/session', access: 'public', body: signInBody,
      handler: async ({ req, body }) => {
        const user = await auth.signIn(body.email, body.password);
        // A fresh session id at sign-in, so an id planted before it is worthless.
        await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
        req.session.userId = user.id;
        await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
        const loaded = await auth.loadActor(user.id);
        if (!loaded) throw unauthorized();
        return loaded.user;
      },
    }),
    route({ method: 'get', path: '/session', access: 'signed-in', handler: async ({ res }) => res.locals.user }),
    route({
      method: 'delete', path: '/session', access: 'public',
      handler: async ({ req, res, actor }) => {
        if (actor) await auth.recordSignOut(actor.id);
        await new Promise<void>((resolve) => (req.session ? req.session.destroy(() => resolve()) : resolve()));
        res.clearCookie('breakover.sid');
        return undefined;
      },
    }),
    route({
      method: 'put', path: '/session/password', access: 'signed-in', body: changePasswordBody,
      handler: async ({ req, actor, body }) => {
        // Every other session of this person ends; this one (the person who knows the new password) stays.
        await auth.changePassword(actor!.id, body.currentPassword, body.newPassword, req.sessionID);
        return undefined;
      },
    }),
    route({ method: 'get', path: '/password/link', access: 'public', query: tokenQuery, handler: async ({ query }) => auth.tokenInfo(query.token) }),
    route({ method: 'post', path: '/password/set', access: 'public', body: setPasswordBody, handler: async ({ body }) => auth.setPassword(body.token, body.password) }),
    route({
      method: 'post', path: '/password/forgot', access: 'public', body: forgotPasswordBody, status: 202,
      handler: async ({ body }) => {
        await auth.forgotPassword(body.email);
        return { message: 'If that address has an account, a link to set a new password is on its way.' };
      },
    }),
  ];
}
