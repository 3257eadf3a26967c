import "server-only";
import { queueCertificateReminders } from "@/lib/services/certificates";

/** Once a day: the calibration certificates whose reminder threshold the structure's date has reached. */
export async function runCertificateReminders(now = Date.now()): Promise<string> {
  const { certificates, mails } = await queueCertificateReminders(now);
  return `${certificates} certificates reminded of, ${mails} e-mails queued`;
}
