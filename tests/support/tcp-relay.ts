/**
 * A TCP relay in front of the test MariaDB, for outage tests: the app connects through it; `stop()` closes
 * it and cuts every open connection (as when the database server goes away), `start(port)` opens it again
 * on the same port. The shared test database itself is never stopped.
 */
import net from "node:net";

export class TcpRelay {
  private server: net.Server | undefined;
  private readonly open = new Set<net.Socket>();
  port = 0;

  constructor(
    private readonly host: string,
    private readonly targetPort: number,
  ) {}

  /** Listens on `port` (0: any free port) and resolves to the port. */
  start(port = this.port): Promise<number> {
    const server = net.createServer((client) => {
      const upstream = net.connect(this.targetPort, this.host);
      for (const s of [client, upstream]) {
        this.open.add(s);
        s.on("close", () => this.open.delete(s));
        s.on("error", () => s.destroy());
      }
      client.pipe(upstream).pipe(client);
      client.on("close", () => upstream.destroy());
      upstream.on("close", () => client.destroy());
    });
    this.server = server;
    return new Promise((resolve) => server.listen(port, "127.0.0.1", () => resolve((this.port = (server.address() as net.AddressInfo).port))));
  }

  /** Refuses new connections and cuts the open ones. */
  stop(): Promise<void> {
    return new Promise<void>((resolve) => {
      if (!this.server) return resolve();
      this.server.close(() => resolve());
      for (const s of this.open) s.destroy();
    });
  }
}
