import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Response } from 'express';
import type { AppConfig } from '../config';

export const SESSION_COOKIE = 'tl_session';
const ALGORITHM = 'HS256';
const AUDIENCE = 'threadline-web';
const ISSUER = 'threadline';

// jsonwebtoken turns a string secret into a key object on every call (first trying it as a
// public key, which throws): 14 % of a signed-in request's time. Make the key once per secret.
const keys = new Map<string, KeyObject>();
function keyOf(config: AppConfig): KeyObject {
  let key = keys.get(config.jwtSecret);
  if (!key) keys.set(config.jwtSecret, (key = createSecretKey(Buffer.from(config.jwtSecret, 'utf8'))));
  return key;
}

/** Sign a session token for a user id. */
export function signSession(config: AppConfig, userId: number): string {
  return jwt.sign({}, keyOf(config), {
    algorithm: ALGORITHM,
    audience: AUDIENCE,
    issuer: ISSUER,
    subject: String(userId),
    expiresIn: Math.round(config.sessionHours * 3600),
  });
}

/**
 * Verify a session token with algorithm, audience and issuer pinned.
 * Returns the user id, or null for any invalid, expired or not-yet-valid token.
 */
export function verifySession(config: AppConfig, token: string): number | null {
  try {
    const payload = jwt.verify(token, keyOf(config), {
      algorithms: [ALGORITHM],
      audience: AUDIENCE,
      issuer: ISSUER,
    });
    if (typeof payload !== 'object' || typeof payload.sub !== 'string' || !/^\d+$/.test(payload.sub)) return null;
    return Number(payload.sub);
  } catch {
    return null;
  }
}

export function setSessionCookie(res: Response, config: AppConfig, token: string): void {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'strict',
    secure: config.env === 'production',
    path: '/',
    maxAge: config.sessionHours * 3600 * 1000,
  });
}

export function clearSessionCookie(res: Response, config: AppConfig): void {
  res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'strict', secure: config.env === 'production', path: '/' });
}

export const SESSION_TOKEN_OPTIONS = { algorithm: ALGORITHM, audience: AUDIENCE, issuer: ISSUER } as const;
