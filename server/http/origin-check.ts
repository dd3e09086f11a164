import type { RequestHandler } from 'express';
import { forbidden } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuse state-changing requests from another origin (defence against cross-site request
 * forgery on top of the SameSite cookie). Requests with no Origin and no Sec-Fetch-Site come
 * from non-browser clients (scripts, tests) and carry no ambient browser cookie risk.
 */
export function originCheck(extraOrigins: string[]): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.get('origin');
    const fetchSite = req.get('sec-fetch-site');
    if (origin) {
      const own = `${req.protocol}://${req.get('host')}`;
      if (origin !== own && !extraOrigins.includes(origin)) {
        return next(forbidden('Requests from another site are refused.'));
      }
    } else if (fetchSite === 'cross-site') {
      return next(forbidden('Requests from another site are refused.'));
    }
    next();
  };
}
