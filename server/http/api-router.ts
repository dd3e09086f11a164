import { Router, type Request, type Response } from 'express';
import { RequestContext, type EntityManager } from '@mikro-orm/sqlite';
import type { z } from 'zod';
import { can, type Permission } from '@shared/permissions';
import { AppError, forbidden, notFound, unauthorized, zodProblemErrors } from '../errors';
import { ProjectMember } from '../modules/projects/project-member.entity';
import { Project } from '../modules/projects/project.entity';
import { User } from '../modules/users/user.entity';
import type { AppConfig } from '../config';
import { SESSION_COOKIE, verifySession } from './session';

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** Who may call a route: anyone, anyone signed in, or holders of a permission. */
export type Access = 'public' | 'signed-in' | Permission;

/** One row of the route table: used by the access-control tests to build the role × route matrix. */
export interface RouteMeta {
  method: Method;
  path: string;
  access: Access;
  /** Project-scoped: the caller must be a member of the project in `:projectId` (admins see all). */
  project: boolean;
  hasBody: boolean;
}

export interface RouteContext<B, Q> {
  req: Request;
  res: Response;
  em: EntityManager;
  config: AppConfig;
  /** The signed-in user (routes with access 'public' get null). */
  user: User;
  /** The project of a project-scoped route. */
  project: Project;
  body: B;
  query: Q;
  params: Record<string, string>;
  /** Set the response status (default 200, or 204 when the handler returns nothing). */
  status(code: number): void;
}

interface RouteOptions<BS extends z.ZodType | undefined, QS extends z.ZodType | undefined> {
  access: Access;
  body?: BS;
  query?: QS;
}

type Infer<S> = S extends z.ZodType ? z.output<S> : undefined;
type Handler<BS, QS> = (ctx: RouteContext<Infer<BS>, Infer<QS>>) => Promise<unknown> | unknown;

/**
 * A thin wrapper over an Express router: each route declares its access and its zod schemas,
 * and the wrapper authenticates, checks project membership, authorises, validates, calls the
 * handler and sends JSON. Errors go to the one error middleware.
 */
export class ApiRouter {
  readonly router = Router({ mergeParams: true });

  constructor(
    private readonly mount: string,
    private readonly registry: RouteMeta[],
    private readonly config: AppConfig,
  ) {}

  /** Where the router is mounted, e.g. `/api/projects/:projectId`. */
  get mountPath(): string {
    return this.mount;
  }

  get<QS extends z.ZodType | undefined = undefined>(path: string, options: RouteOptions<undefined, QS>, handler: Handler<undefined, QS>) {
    this.add('get', path, options, handler);
  }
  post<BS extends z.ZodType | undefined = undefined>(path: string, options: RouteOptions<BS, undefined>, handler: Handler<BS, undefined>) {
    this.add('post', path, options, handler);
  }
  put<BS extends z.ZodType | undefined = undefined>(path: string, options: RouteOptions<BS, undefined>, handler: Handler<BS, undefined>) {
    this.add('put', path, options, handler);
  }
  patch<BS extends z.ZodType | undefined = undefined>(path: string, options: RouteOptions<BS, undefined>, handler: Handler<BS, undefined>) {
    this.add('patch', path, options, handler);
  }
  delete(path: string, options: RouteOptions<undefined, undefined>, handler: Handler<undefined, undefined>) {
    this.add('delete', path, options, handler);
  }

  private add<BS extends z.ZodType | undefined, QS extends z.ZodType | undefined>(
    method: Method,
    path: string,
    options: RouteOptions<BS, QS>,
    handler: Handler<BS, QS>,
  ) {
    const fullPath = `${this.mount}${path}`;
    const projectScoped = fullPath.includes(':projectId');
    this.registry.push({ method, path: fullPath, access: options.access, project: projectScoped, hasBody: Boolean(options.body) });
    const config = this.config;

    this.router[method](path, async (req: Request, res: Response) => {
      const em = RequestContext.getEntityManager() as EntityManager;
      let user: User | null = null;
      if (options.access !== 'public') {
        user = await authenticate(req, em, config);
      }
      let project: Project | null = null;
      if (projectScoped) {
        project = await loadProjectFor(em, user!, String(req.params.projectId));
      }
      if (user && options.access !== 'public' && options.access !== 'signed-in' && !can(user.role, options.access)) {
        throw forbidden();
      }
      const body = options.body ? parseOrThrow(options.body, req.body ?? {}, 'body') : undefined;
      const query = options.query ? parseOrThrow(options.query, req.query, 'query') : undefined;
      let status: number | null = null;
      const result = await handler({
        req,
        res,
        em,
        config,
        user: user as User,
        project: project as Project,
        body: body as Infer<BS>,
        query: query as Infer<QS>,
        params: req.params as Record<string, string>,
        status: (code) => {
          status = code;
        },
      });
      if (res.headersSent) return;
      if (result === undefined) {
        res.status(status ?? 204).end();
      } else {
        res.status(status ?? 200).json(result);
      }
    });
  }
}

function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown, where: 'body' | 'query'): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const errors = zodProblemErrors(result.error).map((e) => (where === 'query' ? { ...e, path: `query.${e.path}` } : e));
    throw new AppError(400, 'validation', 'Some fields are not valid.', { errors });
  }
  return result.data;
}

/** The signed-in user from the session cookie; 401 when absent, invalid, or deactivated. */
export async function authenticate(req: Request, em: EntityManager, config: AppConfig): Promise<User> {
  const token: unknown = req.cookies?.[SESSION_COOKIE];
  if (typeof token !== 'string' || token === '') throw unauthorized();
  const userId = verifySession(config, token);
  if (userId === null) throw unauthorized('Your session is not valid or has expired. Sign in again.');
  const user = await em.findOne(User, userId);
  if (!user || !user.active) throw unauthorized('Your account is not active. Ask an administrator.');
  return user;
}

/** The project of the route, if the user may see it; 404 otherwise (existence is not revealed). */
async function loadProjectFor(em: EntityManager, user: User, rawId: string | undefined): Promise<Project> {
  const id = Number(rawId);
  if (!Number.isSafeInteger(id) || id <= 0) throw notFound('Project');
  // One query: the project, joined to the membership check for everyone but administrators.
  const qb = em.createQueryBuilder(Project, 'p').select('p.*').where({ id });
  if (user.role !== 'admin') {
    qb.andWhere(`exists (select 1 from ${em.getMetadata(ProjectMember).tableName} m where m.project_id = p.id and m.user_id = ?)`, [user.id]);
  }
  const project = await qb.getSingleResult();
  if (!project) throw notFound('Project');
  return project;
}

/** Parse a numeric route id, 404 when it is not one. */
export function idOf(params: Record<string, string>, name: string, what: string): number {
  const id = Number(params[name]);
  if (!Number.isSafeInteger(id) || id <= 0) throw notFound(what);
  return id;
}
