import net from 'node:net';

/**
 * A TCP link between the browser and the e2e server that a test can cut, as a tablet's Wi-Fi drops. Chromium's own
 * offline switch does not reliably stop a request that passed through the service worker: under load such a request
 * sometimes reached the server while the page was told it failed, so a test could not say what the server received.
 * Once cut, nothing more is forwarded: open connections are closed and new ones are refused.
 */
export interface CuttableLink {
  /** The address the browser uses instead of the server's. */
  url: string;
  cut(): void;
  restore(): void;
  close(): Promise<void>;
}

export async function cuttableLink(serverUrl: string): Promise<CuttableLink> {
  const target = new URL(serverUrl);
  const open = new Set<net.Socket>();
  let cut = false;
  const server = net.createServer((client) => {
    if (cut) {
      client.destroy();
      return;
    }
    const upstream = net.connect(Number(target.port), target.hostname);
    open.add(client);
    open.add(upstream);
    const drop = () => {
      client.destroy();
      upstream.destroy();
      open.delete(client);
      open.delete(upstream);
    };
    client.on('error', drop).on('close', drop);
    upstream.on('error', drop).on('close', drop);
    client.on('data', (chunk) => (cut ? drop() : upstream.write(chunk)));
    upstream.on('data', (chunk) => (cut ? drop() : client.write(chunk)));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    cut() {
      cut = true;
      for (const socket of open) socket.destroy();
      open.clear();
    },
    restore() {
      cut = false;
    },
    close: () =>
      new Promise<void>((resolve) => {
        for (const socket of open) socket.destroy();
        server.close(() => resolve());
      }),
  };
}
