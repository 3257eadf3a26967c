import { describe, expect, it } from "vitest";
import { startLocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { BATCH_SIZE } from "@/jobs/outbox-sender";
import { faultDatabase, waitUntil } from "./fault-database";
import { copiesByMessageId, outboxRows, outboxRunAfter, queueMessages } from "./outbox-checks";

// More than two runs' worth, so both instances have due mail in front of them at the same tick.
const MESSAGES = BATCH_SIZE * 2 + 5;
const database = await faultDatabase("two-instances");

describe("two app instances with their jobs on one database", () => {
  it("runs each outbox job once at a time and sends each e-mail once", async () => {
    const relay = await startLocalSmtpServer({ port: 0 });
    try {
      const smtpUrl = `smtp://127.0.0.1:${relay.port}`;
      // Both schedule the outbox every 5 s on the same clock: each tick both reach for the lease.
      const [first, second] = await Promise.all([database.startServer({ jobs: true, smtpUrl }), database.startServer({ jobs: true, smtpUrl })]);
      await queueMessages("pair", MESSAGES);
      await waitUntil("every message to be sent", async () => (await outboxRows()).every((row) => row.state === "sent"));
      await outboxRunAfter(new Date());

      const copies = await copiesByMessageId();
      expect(Object.keys(copies)).toHaveLength(MESSAGES);
      expect(Object.values(copies).filter((n) => n !== 1), `${first.output()}\n${second.output()}`).toEqual([]);
      // Each message went out on its first attempt: no run handed it to the relay a second time.
      expect((await outboxRows()).map((row) => row.attempts)).toEqual(Array.from({ length: MESSAGES }, () => 1));
    } finally {
      await relay.close();
    }
  }, 120_000);
});
