import { Router, type Request, type RequestHandler, type Response } from "express";
import type { ZodType, z } from "zod";
import { forbidden, unauthenticated } from "./errors";
import type { AuthUser } from "./auth";

/**
 * How routes are declared: one spec per endpoint, used twice — to register the Express handler
 * (validating params, query and body with the shared zod schemas) and to describe the endpoint
 * in /api/openapi.json. A route that is not declared this way is not documented, so declare all.
 */
export type AuthLevel = "public" | "user";
type Method = "get" | "post" | "put" | "patch" | "delete";

export interface EndpointSpec<P extends ZodType | undefined, Q extends ZodType | undefined, B extends ZodType | undefined> {
  summary: string;
  auth: AuthLevel;
  tags?: string[];
  params?: P;
  query?: Q;
  body?: B;
  /** Schema of the 2xx JSON body, for the OpenAPI document. */
  response?: ZodType;
  /** Status for a successful answer (default 200; 204 when the handler returns undefined). */
  status?: number;
  /** Accepts multipart/form-data (files) instead of JSON; `upload` runs before validation. */
  upload?: RequestHandler;
  /** Also accepts a personal API token instead of a signed-in browser session. */
  tokenAccess?: boolean;
}

type Infer<T> = T extends ZodType ? z.infer<T> : undefined;

export interface EndpointContext<P, Q, B, U> {
  req: Request;
  res: Response;
  params: P;
  query: Q;
  body: B;
  user: U;
}

export interface RegisteredEndpoint extends EndpointSpec<ZodType | undefined, ZodType | undefined, ZodType | undefined> {
  method: Method;
  path: string;
}

/** Every endpoint declared in this process, in declaration order (read by the OpenAPI builder). */
export const endpointRegistry: RegisteredEndpoint[] = [];

export class ApiRouter {
  // mergeParams: a prefix with parameters ("/labs/:labId/sources") reaches the handlers.
  readonly router = Router({ mergeParams: true });

  /** `prefix` is the mount point under /api, e.g. "/labs". */
  constructor(readonly prefix: string) {}

  get = this.method("get");
  post = this.method("post");
  put = this.method("put");
  patch = this.method("patch");
  delete = this.method("delete");

  private method(method: Method) {
    return <P extends ZodType | undefined = undefined, Q extends ZodType | undefined = undefined, B extends ZodType | undefined = undefined, A extends AuthLevel = AuthLevel>(
      path: string,
      spec: EndpointSpec<P, Q, B> & { auth: A },
      handler: (ctx: EndpointContext<Infer<P>, Infer<Q>, Infer<B>, A extends "user" ? AuthUser : AuthUser | undefined>) => Promise<unknown>,
    ): void => {
      const fullPath = `/api${this.prefix}${path}`.replace(/\/$/, "") || "/api";
      if (!endpointRegistry.some((e) => e.method === method && e.path === fullPath)) {
        endpointRegistry.push({ ...(spec as EndpointSpec<ZodType | undefined, ZodType | undefined, ZodType | undefined>), method, path: fullPath });
      }
      const run: RequestHandler = async (req, res, next) => {
        try {
          if (spec.auth === "user" && !req.user) throw unauthenticated();
          if (req.user?.token && !spec.tokenAccess) throw forbidden("API tokens cannot use this endpoint; sign in in the browser instead.");
          const params = spec.params ? spec.params.parse(req.params) : undefined;
          const query = spec.query ? spec.query.parse(req.query) : undefined;
          const body = spec.body ? spec.body.parse(req.body ?? {}) : undefined;
          const result = await handler({ req, res, params, query, body, user: req.user } as never);
          if (res.headersSent) return;
          if (result === undefined) res.status(204).end();
          else res.status(spec.status ?? 200).json(result);
        } catch (err) {
          next(err);
        }
      };
      this.router[method](path, ...(spec.upload ? [spec.upload] : []), run);
    };
  }
}
