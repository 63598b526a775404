import type { Redis } from 'ioredis';
import { RateLimiterRedis, RateLimiterRes } from 'rate-limiter-flexible';
import { RateLimitedError } from '../lib/errors';

export interface SignInLimits {
  accountLimit: number;
  ipLimit: number;
  windowSeconds: number;
  keyPrefix: string;
}

/** Failed sign-ins are counted per account and every attempt per IP; either running out answers 429. */
export function createSignInLimiter(redis: Redis, limits: SignInLimits) {
  const perAccount = new RateLimiterRedis({
    storeClient: redis,
    keyPrefix: `${limits.keyPrefix}:signin-account`,
    points: limits.accountLimit,
    duration: limits.windowSeconds,
  });
  const perIp = new RateLimiterRedis({
    storeClient: redis,
    keyPrefix: `${limits.keyPrefix}:signin-ip`,
    points: limits.ipLimit,
    duration: limits.windowSeconds,
  });
  const rethrow = (e: unknown): never => {
    if (e instanceof RateLimiterRes) throw new RateLimitedError(Math.ceil(e.msBeforeNext / 1000));
    throw e;
  };
  return {
    async beforeAttempt(email: string, ip: string) {
      const account = await perAccount.get(email);
      if (account && account.consumedPoints >= limits.accountLimit) {
        throw new RateLimitedError(Math.ceil(account.msBeforeNext / 1000));
      }
      await perIp.consume(ip).catch(rethrow);
    },
    async failed(email: string) {
      await perAccount.consume(email).catch(() => undefined);
    },
    async succeeded(email: string) {
      await perAccount.delete(email);
    },
  };
}
export type SignInLimiter = ReturnType<typeof createSignInLimiter>;
