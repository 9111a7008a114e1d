import net from 'node:net';

/**
 * A TCP relay between the API and PostgreSQL that a test can cut and restore, so "the database
 * went away" is a real network failure, not a mock.
 */
export function createRelay(targetPort: number) {
  const sockets = new Set<net.Socket>();
  let server: net.Server | undefined;
  let port = 0;
  const listen = () =>
    new Promise<number>((resolve) => {
      server = net.createServer((client) => {
        const upstream = net.connect(targetPort, '127.0.0.1');
        sockets.add(client).add(upstream);
        client.pipe(upstream).pipe(client);
        const drop = () => {
          client.destroy();
          upstream.destroy();
        };
        client.on('error', drop).on('close', drop);
        upstream.on('error', drop).on('close', drop);
      });
      server.listen(port, '127.0.0.1', () => {
        port = (server!.address() as net.AddressInfo).port;
        resolve(port);
      });
    });
  const cut = () =>
    new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      sockets.clear();
      if (!server?.listening) return resolve();
      server.close(() => resolve());
    });
  return { listen, cut };
}

/** The test cluster's port, to relay to. */
export const testDatabasePort = () => Number(new URL(process.env.TEST_DATABASE_ADMIN_URL!).port);

/** Points a database URL at the relay's port. */
export const throughRelay = (relayPort: number) => (url: string) => {
  const u = new URL(url);
  u.port = String(relayPort);
  return u.toString();
};
