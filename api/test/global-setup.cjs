'use strict';
/**
 * Starts a throwaway PostgreSQL cluster and Redis for the api's tests, unless the environment already
 * points at them (`npm test` starts one pair for every workspace and sets DATABASE_URL and REDIS_URL).
 */
const { startThrowawayServices } = require('../scripts/local-services.cjs');

module.exports = async function globalSetup() {
  if (process.env.DATABASE_URL && process.env.REDIS_URL) return;
  const services = await startThrowawayServices();
  process.env.DATABASE_URL = services.databaseUrl;
  process.env.REDIS_URL = services.redisUrl;
  globalThis.__provenoteServices = services;
};
