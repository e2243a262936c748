/** A TCP port on loopback that nothing listens on at the moment (the operating system picks it). */
import { createServer, type AddressInfo } from "node:net";

export const freePort = (): Promise<number> =>
  new Promise<number>((resolve) => {
    const probe = createServer().listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as AddressInfo;
      probe.close(() => resolve(port));
    });
  });
