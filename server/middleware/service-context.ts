import type { Request, Response } from 'express';
import type { AppDeps, RequestMeta, ServiceContext } from '../context';

/** Address, user agent and request id, for the audit log and the logs. */
export function requestMeta(req: Request, res: Response): RequestMeta {
  return { ip: req.ip ?? null, userAgent: req.get('user-agent') ?? null, requestId: res.locals.requestId };
}

/** The context services receive for this request: the app's dependencies, the caller, the request metadata. */
export function serviceContext(deps: AppDeps, req: Request, res: Response): ServiceContext {
  return { ...deps, log: req.log ?? deps.log, actor: res.locals.principal ?? null, meta: requestMeta(req, res) };
}
