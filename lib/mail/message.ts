/** What every message builder returns: the parts of an e-mail that depend on its purpose. */
export type BuiltMail = { subject: string; text: string; html: string };

/** The app's public address, where links in e-mails point (no trailing slash). */
export function appUrl(): string {
  return (process.env.NEXTAUTH_URL || "http://localhost:3000").replace(/\/+$/, "");
}

const HTML_ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

/** Names and values typed by people end up in HTML mail: escape them all. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!);
}

/**
 * The HTML frame shared by every message: inline styles only, because mail readers drop
 * style sheets, and a footer saying why the person got it.
 */
export function htmlFrame(title: string, body: string, footer: string): string {
  return [
    "<!doctype html>",
    `<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#f8fafc;font-family:Arial,Helvetica,sans-serif;color:#0f172a;font-size:15px;line-height:1.5">',
    '<div style="max-width:600px;margin:0 auto;background:#ffffff;border:1px solid #e2e8f0;border-radius:8px;padding:24px">',
    '<p style="margin:0 0 16px;font-weight:bold;color:#1d4ed8">Hookeline</p>',
    body,
    `<p style="margin:24px 0 0;font-size:12px;color:#64748b">${escapeHtml(footer)}</p>`,
    "</div></body></html>",
  ].join("\n");
}

/** A button-like link that still reads as a plain link where styles are off. */
export function htmlButton(href: string, label: string): string {
  return `<p style="margin:20px 0"><a href="${escapeHtml(href)}" style="display:inline-block;background:#1d4ed8;color:#ffffff;padding:10px 16px;border-radius:6px;text-decoration:none;font-weight:bold">${escapeHtml(label)}</a></p>`;
}

export const htmlParagraph = (text: string) => `<p style="margin:0 0 12px">${escapeHtml(text)}</p>`;

/** A message whose point is one link (invitations, password resets): the link in full in the text part, a button in HTML. */
export function buildLinkMail(parts: { subject: string; lines: string[]; link: string; buttonLabel: string; footer: string }): BuiltMail {
  const { subject, lines, link, buttonLabel, footer } = parts;
  return {
    subject,
    text: [...lines, link, footer].join("\n\n"),
    html: htmlFrame(subject, [...lines.map(htmlParagraph), htmlButton(link, buttonLabel)].join("\n"), footer),
  };
}
