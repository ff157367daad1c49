// Local fake SMTP server (demo and tests): speaks real SMTP on loopback and keeps
// every message it receives in captured_emails, where the outbox page and the
// tests read it. Never used when SMTP_URL points at a real provider.
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { storeCapturedEmail } from "../db/queries/mail";

const port = Number(process.env.FAKE_SMTP_PORT ?? "2525");

const server = new SMTPServer({
  secure: false,
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  banner: "Plinthwise local mail catcher",
  size: 5 * 1024 * 1024,
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", () => {
      const raw = Buffer.concat(chunks).toString("utf8");
      simpleParser(raw)
        .then((mail) =>
          storeCapturedEmail({
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            raw,
          }),
        )
        .then(() => callback())
        .catch((err: unknown) => {
          console.error("[fake-smtp] could not keep a message:", err);
          callback(new Error("451 temporary failure, try again"));
        });
    });
  },
});

server.on("error", (err) => console.error("[fake-smtp]", err.message));
server.listen(port, "127.0.0.1", () => console.log(`[fake-smtp] listening on 127.0.0.1:${port}`));

function stop() {
  server.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
}
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
