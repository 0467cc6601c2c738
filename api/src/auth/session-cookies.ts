import type { CookieOptions, Response } from 'express';
import type { AppConfig } from '../config/config';
import { newSecret } from './tokens';

/**
 * Sessions are httpOnly, SameSite=Lax cookies backed by the `sessions` table. Unsafe methods also need the
 * double-submit CSRF defence: the readable `provenote_csrf` cookie must be echoed in the `X-CSRF-Token`
 * header, which a page on another origin can neither read nor set.
 */
export const SESSION_COOKIE = 'provenote_session';
export const CSRF_COOKIE = 'provenote_csrf';
export const CSRF_HEADER = 'x-csrf-token';
export const SESSION_TTL_MS = 14 * 24 * 60 * 60 * 1000;
/** A session used when less than this remains is extended, so active people are not signed out mid-work. */
export const SESSION_RENEW_BELOW_MS = 7 * 24 * 60 * 60 * 1000;

function baseOptions(config: AppConfig): CookieOptions {
  return { path: '/', sameSite: 'lax', secure: config.PUBLIC_URL.startsWith('https:') };
}

export function setSessionCookie(res: Response, config: AppConfig, token: string, expiresAt: Date) {
  res.cookie(SESSION_COOKIE, token, { ...baseOptions(config), httpOnly: true, expires: expiresAt });
}

export function clearSessionCookie(res: Response, config: AppConfig) {
  res.clearCookie(SESSION_COOKIE, { ...baseOptions(config), httpOnly: true });
}

/** Issues a CSRF token cookie (readable by the page's script) and returns the token. */
export function issueCsrfCookie(res: Response, config: AppConfig): string {
  const token = newSecret();
  res.cookie(CSRF_COOKIE, token, { ...baseOptions(config), httpOnly: false });
  return token;
}
