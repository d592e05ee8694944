import type { Request } from 'express';
import { ipKeyGenerator, rateLimit, type Options } from 'express-rate-limit';

const FIFTEEN_MINUTES = 15 * 60 * 1000;

function limiter(opts: { name: string; limit: number; windowMs: number; key: 'ip' | 'email'; failuresOnly: boolean }) {
  const keyGenerator: Options['keyGenerator'] = (req: Request) => {
    if (opts.key === 'email') {
      const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
      if (email) return `${opts.name}:email:${email}`;
    }
    return `${opts.name}:ip:${ipKeyGenerator(req.ip ?? '0.0.0.0')}`;
  };
  return rateLimit({
    windowMs: opts.windowMs,
    limit: opts.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: opts.failuresOnly,
    keyGenerator,
    handler: (_req, res, _next, options) => {
      const minutes = Math.ceil(options.windowMs / 60000);
      res.status(429).json({ error: `Too many attempts. Wait ${minutes} minutes and try again, or reset your password.`, code: 'rate_limited' });
    },
  });
}

/**
 * Limits for sign-in and password reset, per IP and per e-mail. Sign-in counts only failures, so
 * people who type their password right are never slowed down. In-memory per server process.
 */
export function createAuthLimits() {
  return {
    signInPerIp: limiter({ name: 'sign-in', limit: 30, windowMs: FIFTEEN_MINUTES, key: 'ip', failuresOnly: true }),
    signInPerEmail: limiter({ name: 'sign-in', limit: 8, windowMs: FIFTEEN_MINUTES, key: 'email', failuresOnly: true }),
    signUpPerIp: limiter({ name: 'sign-up', limit: 50, windowMs: FIFTEEN_MINUTES, key: 'ip', failuresOnly: false }),
    resetPerIp: limiter({ name: 'reset', limit: 20, windowMs: FIFTEEN_MINUTES, key: 'ip', failuresOnly: false }),
    resetPerEmail: limiter({ name: 'reset', limit: 5, windowMs: FIFTEEN_MINUTES, key: 'email', failuresOnly: false }),
    acceptPerIp: limiter({ name: 'accept', limit: 20, windowMs: FIFTEEN_MINUTES, key: 'ip', failuresOnly: true }),
    resetConfirmPerIp: limiter({ name: 'reset-confirm', limit: 20, windowMs: FIFTEEN_MINUTES, key: 'ip', failuresOnly: true }),
  };
}
