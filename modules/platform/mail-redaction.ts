/**
 * One-time links in a mail body, replaced by a placeholder. A reset or invitation link
 * is a password: once the message has been handed to the mail server, the copy we keep
 * (and what the instance administrator sees on the outbox) must not carry it.
 */
export const REDACTED_TOKEN = "[link removed after sending]";

export function redactOneTimeLinks(text: string): string {
  return text.replace(/\/(reset|invite)\/[A-Za-z0-9_-]{16,}/g, (_m, kind: string) => `/${kind}/${REDACTED_TOKEN}`);
}
