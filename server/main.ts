import 'reflect-metadata';
import { createServer } from 'node:http';
import { loadEnv } from './env';
import { closeDeps, createDeps } from './deps';
import { createApp } from './app';

const env = loadEnv();
const deps = await createDeps(env, 'api');
const server = createServer(createApp(deps));
server.listen(env.PORT, env.HOST, () => deps.logger.info('api listening', { host: env.HOST, port: env.PORT }));

let closing = false;
async function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  deps.logger.info('api shutting down', { signal });
  // Stop taking connections, let in-flight requests finish, then close the pools.
  server.close();
  server.closeIdleConnections();
  const force = setTimeout(() => server.closeAllConnections(), 10_000).unref();
  await new Promise((r) => server.once('close', r));
  clearTimeout(force);
  await closeDeps(deps);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
