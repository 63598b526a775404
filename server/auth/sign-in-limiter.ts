import type { Redis } from 'ioredis';
import { RateLimiterRedis, RateLimiterRes } from 'rate-limiter-flexible';
import { RateLimitedError, ServiceUnavailableError } from '../lib/errors';

export interface SignInLimits {
  /** Consecutive failures for one account from one address; blocks that pair only. */
  pairLimit: number;
  /** Every attempt from one address, whatever the account. */
  ipLimit: number;
  /** Window (and block time) of the two above. */
  windowSeconds: number;
  /** Failures for one account from anywhere: the slower limit that stops a spread-out guess at one account. */
  accountLimit: number;
  accountWindowSeconds: number;
  keyPrefix: string;
}

export type SignInBlock = 'pair' | 'ip' | 'account';

/** A refused attempt: which limit, and when it may be tried again. */
export class SignInBlockedError extends RateLimitedError {
  constructor(readonly limit: SignInBlock, retryAfterSeconds: number) {
    super(retryAfterSeconds);
  }
}

const retryAfter = (res: { msBeforeNext: number }) => Math.max(1, Math.ceil(res.msBeforeNext / 1000));

// Redis unreachable: the limits cannot be checked, so sign-in waits rather than running unlimited.
const unavailable = (e: unknown): never => {
  if (e instanceof RateLimiterRes || e instanceof SignInBlockedError) throw e;
  throw new ServiceUnavailableError('Signing in is briefly unavailable. Please try again in a moment.');
};

/**
 * rate-limiter-flexible's "login endpoint protection" pattern: failures are counted per account + address, so a
 * stranger's wrong guesses block the stranger, not the account's owner on their own device; every attempt per
 * address; and a slow per-account count over a day so guesses spread over many addresses still stop.
 */
export function createSignInLimiter(redis: Redis, limits: SignInLimits) {
  const perPair = new RateLimiterRedis({
    storeClient: redis, keyPrefix: `${limits.keyPrefix}:signin-pair`, points: limits.pairLimit, duration: limits.windowSeconds,
  });
  const perIp = new RateLimiterRedis({
    storeClient: redis, keyPrefix: `${limits.keyPrefix}:signin-ip`, points: limits.ipLimit, duration: limits.windowSeconds,
  });
  const perAccount = new RateLimiterRedis({
    storeClient: redis, keyPrefix: `${limits.keyPrefix}:signin-account`, points: limits.accountLimit, duration: limits.accountWindowSeconds,
  });
  const pairKey = (email: string, ip: string) => `${email}|${ip}`;
  const alertKey = (email: string) => `${limits.keyPrefix}:signin-alerted:${email}`;

  return {
    /** Throws SignInBlockedError when a limit has run out; counts the attempt against the address. */
    async beforeAttempt(email: string, ip: string): Promise<void> {
      const [pair, account] = await Promise.all([perPair.get(pairKey(email, ip)), perAccount.get(email)]).catch(unavailable);
      if (pair && pair.consumedPoints >= limits.pairLimit) throw new SignInBlockedError('pair', retryAfter(pair));
      if (account && account.consumedPoints >= limits.accountLimit) throw new SignInBlockedError('account', retryAfter(account));
      await perIp.consume(ip).catch((e: unknown) => {
        if (e instanceof RateLimiterRes) throw new SignInBlockedError('ip', retryAfter(e));
        return unavailable(e);
      });
    },

    /** Counts a failure; returns the account's failures in its window so far. */
    async failed(email: string, ip: string): Promise<number> {
      const settle = (p: Promise<RateLimiterRes>) => p.catch((e: unknown) => (e instanceof RateLimiterRes ? e : unavailable(e)));
      const [, account] = await Promise.all([settle(perPair.consume(pairKey(email, ip))), settle(perAccount.consume(email))]);
      return account.consumedPoints;
    },

    async succeeded(email: string, ip: string): Promise<void> {
      await perPair.delete(pairKey(email, ip)).catch(unavailable);
    },

    /** True once per account window: whether to tell the owner their account is being tried. */
    async shouldAlert(email: string): Promise<boolean> {
      return (await redis.set(alertKey(email), '1', 'EX', limits.accountWindowSeconds, 'NX').catch(unavailable)) === 'OK';
    },
  };
}
export type SignInLimiter = ReturnType<typeof createSignInLimiter>;
