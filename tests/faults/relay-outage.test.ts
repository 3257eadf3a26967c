import { describe, expect, it } from "vitest";
import { startLocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { freePort } from "../free-port";
import { faultDatabase, waitUntil } from "./fault-database";
import { copiesByMessageId, outboxRows, outboxRunAfter, queueMessages } from "./outbox-checks";

const MESSAGES = 6;
const database = await faultDatabase("relay-outage");

describe("the mail relay down, then back", () => {
  it("keeps the queued mail while the relay is unreachable and delivers each message once when it returns", async () => {
    // Nothing listens on the relay's port yet: connections are refused, as with a relay that is down.
    const relayPort = await freePort();
    const server = await database.startServer({ jobs: true, smtpUrl: `smtp://127.0.0.1:${relayPort}` });
    const addresses = await queueMessages("outage", MESSAGES);

    await waitUntil("the sender to meet the unreachable relay", async () => (await outboxRows()).some((row) => row.attempts > 0));
    await waitUntil("every message to be handed back to the queue", async () => (await outboxRows()).every((row) => row.state === "queued"));
    const whileDown = await outboxRows();
    expect(whileDown.map((row) => row.state)).toEqual(addresses.map(() => "queued"));
    expect(whileDown.filter((row) => row.lastError).length).toBeGreaterThan(0);

    const relay = await startLocalSmtpServer({ port: relayPort });
    try {
      const relayBack = Date.now();
      await waitUntil("every message to be sent", async () => (await outboxRows()).every((row) => row.state === "sent"));
      console.log(`Relay back: all ${MESSAGES} messages delivered ${((Date.now() - relayBack) / 1000).toFixed(1)} s later.`);
      await outboxRunAfter(new Date());
      const rows = await outboxRows();
      const copies = await copiesByMessageId();
      expect(Object.keys(copies)).toHaveLength(MESSAGES);
      expect(Object.values(copies), server.output()).toEqual(rows.map(() => 1));
    } finally {
      await relay.close();
    }
  }, 120_000);
});
