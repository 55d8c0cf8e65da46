// A round-robin TCP balancer on loopback in front of several web processes, for the fault test and the load bench.
// Each new connection goes to the next backend; one that refuses the connection (a process that died) is skipped
// for that connection, as a health-checking balancer would, so clients only see the requests cut off mid-flight.
import net from 'node:net';

export interface Balancer {
  port: number;
  baseUrl: string;
  /** Connections handed to each backend port so far, in the order the ports were given. */
  connections(): number[];
  close(): Promise<void>;
}

export async function startBalancer(backendPorts: number[], host = '127.0.0.1'): Promise<Balancer> {
  if (backendPorts.length === 0) throw new Error('the balancer needs at least one backend port');
  const counts = backendPorts.map(() => 0);
  const open = new Set<net.Socket>();
  let next = 0;

  /** Connects to the next backend that accepts, trying each once; null when none does. */
  const connectBackend = (attempt = 0): Promise<net.Socket | null> => {
    if (attempt >= backendPorts.length) return Promise.resolve(null);
    const index = next++ % backendPorts.length;
    return new Promise((resolve) => {
      const upstream = net.connect(backendPorts[index], host);
      upstream.once('connect', () => {
        counts[index]++;
        resolve(upstream);
      });
      upstream.once('error', () => {
        upstream.destroy();
        resolve(connectBackend(attempt + 1));
      });
    });
  };

  const server = net.createServer((client) => {
    open.add(client);
    client.once('close', () => open.delete(client));
    client.pause();
    void connectBackend().then((upstream) => {
      if (!upstream) return client.destroy();
      open.add(upstream);
      upstream.once('close', () => open.delete(upstream));
      // Either side ending or dying ends the other, as a dead process's connections end at the client.
      const end = () => {
        client.destroy();
        upstream.destroy();
      };
      client.on('error', end).on('close', end);
      upstream.on('error', end).on('close', end);
      client.pipe(upstream);
      upstream.pipe(client);
      client.resume();
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, host, () => resolve());
  });
  const port = (server.address() as net.AddressInfo).port;
  return {
    port,
    baseUrl: `http://${host}:${port}`,
    connections: () => [...counts],
    close: () =>
      new Promise<void>((resolve) => {
        for (const socket of open) socket.destroy();
        server.close(() => resolve());
      }),
  };
}

/** Starts `count` web processes with `startOne` (each answering with its port) and the balancer in front of them. */
export async function startBehindBalancer<T extends { port: number }>(count: number, startOne: (index: number) => Promise<T>) {
  const processes: T[] = [];
  for (let i = 0; i < count; i++) processes.push(await startOne(i));
  const balancer = await startBalancer(processes.map((p) => p.port));
  return { processes, balancer };
}
