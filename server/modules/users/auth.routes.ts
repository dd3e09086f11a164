import { rateLimit } from 'express-rate-limit';
import type { SessionDto } from '@shared/api';
import { loginSchema } from '@shared/schemas/auth';
import { AppError, unauthorized } from '../../errors';
import { ApiRouter, type RouteMeta } from '../../http/api-router';
import { clearSessionCookie, setSessionCookie, signSession } from '../../http/session';
import type { AppConfig } from '../../config';
import { checkPassword, DUMMY_HASH } from './password';
import { presentUser } from './user.presenter';
import { User } from './user.entity';

/** Sign in, sign out, and who am I. */
export function authRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/auth', registry, config);

  // Only failures count, per client address: a crew signing in from one phone is never blocked.
  api.router.use(
    '/login',
    rateLimit({
      windowMs: config.loginWindowMinutes * 60_000,
      limit: config.loginMaxAttempts,
      skipSuccessfulRequests: true,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next) => {
        next(new AppError(429, 'throttled', `Too many failed sign-ins from this address. Wait ${config.loginWindowMinutes} minutes and try again.`));
      },
    }),
  );

  api.post('/login', { access: 'public', body: loginSchema }, async ({ em, body, req, res }): Promise<SessionDto> => {
    const user = await em.findOne(User, { email: body.email });
    const ok = await checkPassword(body.password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !ok || !user.active) {
      // JSON logging escapes control characters, so a crafted e-mail cannot forge a log line.
      req.log?.warn({ event: 'login_failed', email: body.email.slice(0, 254), ip: req.ip }, 'sign-in refused');
      throw unauthorized('E-mail or password is wrong, or the account is not active.');
    }
    setSessionCookie(res, config, signSession(config, user.id));
    return { user: presentUser(user) };
  });

  api.post('/logout', { access: 'public' }, ({ res }) => {
    clearSessionCookie(res, config);
  });

  api.get('/me', { access: 'signed-in' }, ({ user }): SessionDto => ({ user: presentUser(user) }));

  return api;
}
