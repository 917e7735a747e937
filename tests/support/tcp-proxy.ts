import net from 'node:net';

/**
 * A TCP proxy in front of the test database, on a port of its own: `cut()` drops every connection and
 * refuses new ones (as a stopped server does), `hang()` accepts and never answers, `restore()` forwards again.
 */
export async function tcpProxy(target: { host: string; port: number }) {
  let mode: 'forward' | 'hang' = 'forward';
  const sockets = new Set<net.Socket>();
  const track = (s: net.Socket) => {
    sockets.add(s);
    s.on('close', () => sockets.delete(s));
    s.on('error', () => s.destroy());
  };
  const server = net.createServer((client) => {
    track(client);
    if (mode === 'hang') return;
    const upstream = net.connect(target.port, target.host);
    track(upstream);
    client.pipe(upstream).pipe(client);
    client.on('close', () => upstream.destroy());
    upstream.on('close', () => client.destroy());
  });
  const listen = (port: number) => new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  await listen(0);
  const port = (server.address() as net.AddressInfo).port;
  const dropAll = () => sockets.forEach((s) => s.destroy());
  return {
    port,
    /** The URL with host and port replaced by the proxy's. */
    via(url: string) {
      const u = new URL(url);
      u.hostname = '127.0.0.1';
      u.port = String(port);
      return u.toString();
    },
    async cut() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        dropAll();
      });
    },
    async hang() {
      mode = 'hang';
      dropAll();
    },
    async restore() {
      mode = 'forward';
      if (!server.listening) await listen(port);
    },
    async close() {
      await this.cut();
    },
  };
}
