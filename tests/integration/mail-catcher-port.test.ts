import net from "node:net";
import { afterEach, describe, expect, it } from "vitest";
import { openMailCatcher, startLocalSmtpServer, type LocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { freePort } from "./mail-helpers";

const opened: { close(): unknown }[] = [];
afterEach(async () => {
  for (const server of opened.splice(0)) await server.close();
});

async function catcherOf(databaseUrl: string, port: number): Promise<LocalSmtpServer> {
  const own = process.env.DATABASE_URL;
  process.env.DATABASE_URL = databaseUrl;
  try {
    const server = await startLocalSmtpServer({ port });
    opened.push(server);
    return server;
  } finally {
    process.env.DATABASE_URL = own;
  }
}

describe("the mail catcher's port", () => {
  it("is left to a catcher of another instance on the same database, which catches for both", async () => {
    const port = await freePort();
    await catcherOf(process.env.DATABASE_URL!, port);
    await expect(openMailCatcher(port)).resolves.toBeNull();
  });

  it("is refused when another database's catcher holds it, naming a free port to use instead", async () => {
    const port = await freePort();
    await catcherOf("file:/tmp/some-other-hookeline.db", port);
    const refusal = openMailCatcher(port);
    await expect(refusal).rejects.toThrow(`Port ${port} is held by a Hookeline instance with another database`);
    await expect(refusal).rejects.toThrow(/LOCAL_SMTP_PORT=\d+/);
  });

  it("is refused when another program holds it, quoting its greeting", async () => {
    const port = await freePort();
    const other = net.createServer((socket) => socket.end("220 relay.example ESMTP ready\r\n"));
    await new Promise<void>((resolve) => other.listen(port, "127.0.0.1", resolve));
    opened.push({ close: () => new Promise((done) => other.close(done)) });
    await expect(openMailCatcher(port)).rejects.toThrow('another program (it greets with "220 relay.example ESMTP ready")');
  });

  it("is taken when free", async () => {
    const server = await openMailCatcher(await freePort());
    opened.push(server!);
    expect(server).not.toBeNull();
  });
});
