import { defineEntity } from '@mikro-orm/core';

/**
 * The table rate-limiter-flexible's Postgres store reads and writes (its own column layout).
 * Declared here so migrations create it and every app server shares the same counters.
 */
export const RateLimitBucket = defineEntity({
  name: 'RateLimitBucket',
  tableName: 'rate_limits',
  properties: (p) => ({
    key: p.string().length(255).primary(),
    points: p.integer().default(0),
    expire: p.bigint('number').nullable(),
  }),
});
