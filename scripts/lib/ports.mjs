import net from 'node:net';

/** A TCP port on 127.0.0.1 that is free right now. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

/**
 * Starts `server` listening on `host:port` (0: a free port); resolves with the bound port,
 * rejects when the port is taken. The local fakes (mail-fake/, search-fake/) listen this way.
 * @param {import('node:net').Server} server @param {number} port @param {string} [host]
 * @returns {Promise<number>}
 */
export function listenOn(server, port, host = '127.0.0.1') {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      const address = server.address();
      resolve(typeof address === 'object' && address ? address.port : port);
    });
  });
}

/** Resolves once something accepts connections on host:port, or rejects after `timeoutMs`. */
export async function waitForPort(port, host = '127.0.0.1', timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const open = await new Promise((resolve) => {
      const socket = net.connect(port, host, () => {
        socket.end();
        resolve(true);
      });
      socket.on('error', () => resolve(false));
    });
    if (open) return;
    if (Date.now() > deadline) throw new Error(`Nothing listened on ${host}:${port} within ${timeoutMs} ms.`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
