// Local stand-ins for the outside world, on loopback only: an S3-compatible store (s3rver)
// and an SMTP catcher that keeps every message as JSON in a folder.
// Usage: node scripts/fakes.mjs --s3-dir D --s3-port P --bucket B --smtp-port Q --mail-dir M
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { mkdirSync, renameSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { randomUUID } from "node:crypto";

const args = Object.fromEntries(
  process.argv.slice(2).reduce((pairs, a, i, all) => (a.startsWith("--") ? [...pairs, [a.slice(2), all[i + 1]]] : pairs), []),
);
const s3Dir = args["s3-dir"];
const mailDir = args["mail-dir"];
mkdirSync(s3Dir, { recursive: true });
mkdirSync(mailDir, { recursive: true });

const s3 = new S3rver({
  address: "127.0.0.1",
  port: Number(args["s3-port"]),
  silent: true,
  directory: s3Dir,
  configureBuckets: [{ name: args.bucket }],
});
await s3.run();

const smtp = new SMTPServer({
  authOptional: true,
  disableReverseLookup: true, // loopback only: no DNS lookup of the client per connection
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const id = `${Date.now()}-${randomUUID().slice(0, 8)}`;
        const record = {
          id,
          receivedAt: new Date().toISOString(),
          sessionId: session.id, // the SMTP connection it came over
          messageId: mail.messageId ?? "", // the same on every try of one outbox row
          from: mail.from?.text ?? "",
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : "",
          // Every header as sent (folded lines unfolded), for tests of List-Unsubscribe and the like.
          headers: Object.fromEntries((mail.headerLines ?? []).map((h) => [h.key, h.line.slice(h.line.indexOf(":") + 1).replace(/\r?\n[ \t]+/g, " ").trim()])),
          attachments: (mail.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, size: a.size })),
        };
        // Written aside and renamed: a reader never sees half a message.
        writeFileSync(join(mailDir, `${id}.json.part`), JSON.stringify(record, null, 2));
        renameSync(join(mailDir, `${id}.json.part`), join(mailDir, `${id}.json`));
        callback();
      })
      .catch((err) => callback(err));
  },
});
await new Promise((resolve, reject) => {
  smtp.once("error", reject);
  smtp.listen(Number(args["smtp-port"]), "127.0.0.1", resolve);
});
console.log(`fakes: s3 on 127.0.0.1:${args["s3-port"]} (bucket ${args.bucket}), smtp catcher on 127.0.0.1:${args["smtp-port"]}`);

const stop = async () => {
  await Promise.allSettled([s3.close(), new Promise((r) => smtp.close(r))]);
  process.exit(0);
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
