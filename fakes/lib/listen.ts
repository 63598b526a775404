import type { Server } from 'node:http';
import type { Server as NetServer, AddressInfo } from 'node:net';

/** Resolves with the bound port, so callers can pass 0 and still learn where the fake is. */
export function listenOn(server: NetServer, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

/** A fake told to time out keeps requests open forever; closing must not wait for them. */
export function closeHttp(server: Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.close((err) => (err ? reject(err) : resolve()));
    server.closeAllConnections();
  });
}

/** Stops the fake on SIGTERM/SIGINT, the way scripts/start.sh ends its children. */
export function closeOnSignals(close: () => Promise<void>, onError: (err: unknown) => void): void {
  let closing = false;
  const stop = () => {
    if (closing) return;
    closing = true;
    close().then(
      () => process.exit(0),
      (err) => {
        onError(err);
        process.exit(1);
      },
    );
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}
