import type { RequestHandler } from 'express';
import type { AppDeps } from '../context';

/** Calculation endpoints: N requests per address and minute (runs before anything else of the route). */
export function calcRequestLimit(deps: AppDeps): RequestHandler {
  return async (req, res, next) => {
    const { limit, remaining } = await deps.limits.takeCalcRequest(req.ip ?? 'unknown');
    res.setHeader('RateLimit-Limit', String(limit));
    res.setHeader('RateLimit-Remaining', String(remaining));
    next();
  };
}

/** Calculation endpoints: the request's equation lines (measured before) against the address's line budget. */
export function calcLineBudget(deps: AppDeps): RequestHandler {
  return async (req, res, next) => {
    await deps.limits.takeCalcLines(req.ip ?? 'unknown', res.locals.calcLines ?? 1);
    next();
  };
}
