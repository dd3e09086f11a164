import type { UserDto } from '@shared/api';
import { userCreateSchema, userUpdateSchema } from '@shared/schemas/auth';
import { AppError, conflict, notFound, staleVersion } from '../../errors';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import type { AppConfig } from '../../config';
import { logActivity } from '../activity/activity.service';
import { hashPassword } from './password';
import { presentUser } from './user.presenter';
import { User } from './user.entity';

/** The administrator's user list; managers may read it to add project members. */
export function userRoutes(registry: RouteMeta[], config: AppConfig): ApiRouter {
  const api = new ApiRouter('/api/users', registry, config);

  api.get('/', { access: 'member.manage' }, async ({ em }): Promise<UserDto[]> => {
    const users = await em.find(User, {}, { orderBy: { name: 'asc' } });
    return users.map(presentUser);
  });

  api.post('/', { access: 'user.manage', body: userCreateSchema }, async ({ em, body, user, status }): Promise<UserDto> => {
    if ((await em.count(User, { email: body.email })) > 0) {
      throw new AppError(409, 'duplicate', `A user with e-mail ${body.email} already exists.`, { errors: [{ path: 'email', message: 'is already used by another user' }] });
    }
    const hash = await hashPassword(body.password);
    const dto = await em.transactional(async (tem) => {
      const created = new User(body.email, body.name, body.role, hash);
      await tem.persistAndFlush(created);
      const presented = presentUser(created);
      logActivity(tem, { project: null, user, entity: 'user', entityId: created.id, action: 'create', before: null, after: presented });
      return presented;
    });
    status(201);
    return dto;
  });

  api.patch('/:userId', { access: 'user.manage', body: userUpdateSchema }, async ({ em, body, params, user }): Promise<UserDto> => {
    const target = await em.findOne(User, idOf(params, 'userId', 'User'));
    if (!target) throw notFound('User');
    if (body.version !== target.version) throw staleVersion(presentUser(target));
    if (target.id === user.id && (body.active === false || (body.role && body.role !== 'admin'))) {
      throw conflict('You cannot deactivate yourself or remove your own administrator role.');
    }
    const before = presentUser(target);
    if (body.name !== undefined) target.name = body.name;
    if (body.role !== undefined) target.role = body.role;
    if (body.active !== undefined) target.active = body.active;
    if (body.password !== undefined) target.passwordHash = await hashPassword(body.password);
    logActivity(em, {
      project: null,
      user,
      entity: 'user',
      entityId: target.id,
      action: body.password !== undefined ? 'update+password' : 'update',
      before,
      after: presentUser(target),
    });
    await em.flush();
    return presentUser(target);
  });

  return api;
}
