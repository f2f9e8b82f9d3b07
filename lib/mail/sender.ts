import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { db } from "@/db";
import { claimDueMail, markMailFailed, markMailSent } from "@/db/queries/mail";
import { env } from "@/lib/env";

let transporter: Transporter | undefined;
let timer: ReturnType<typeof setInterval> | undefined;
let running: Promise<number> | undefined;

function transport(): Transporter {
  transporter ??= nodemailer.createTransport(env().SMTP_URL, { from: env().MAIL_FROM });
  return transporter;
}

/** Sends what is due; returns how many were sent. A failure leaves the message queued with a later attempt. */
export async function deliverDueMail(): Promise<number> {
  if (running) return running;
  running = (async () => {
    let sent = 0;
    const due = await claimDueMail(db);
    for (const m of due) {
      try {
        await transport().sendMail({ from: env().MAIL_FROM, to: m.to, subject: m.subject, text: m.text, html: m.html ?? undefined,
          attachments: m.attachments?.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.contentBase64, "base64") })),
        });
        await markMailSent(db, m.id);
        sent++;
      } catch (err) {
        await markMailFailed(db, m.id, m.attempts, err instanceof Error ? err.message : String(err));
      }
    }
    return sent;
  })().finally(() => {
    running = undefined;
  });
  return running;
}

/** Starts the background sender once per server process, and sends soon after each new message. */
export function startMailWorker(): void {
  if (timer || process.env.NEXT_PHASE === "phase-production-build") return;
  timer = setInterval(() => void deliverDueMail().catch((e) => console.error("mail sender:", e instanceof Error ? e.message : e)), 2000);
  timer.unref?.();
}

export function kickMailWorker(): void {
  startMailWorker();
  setTimeout(() => void deliverDueMail().catch(() => undefined), 50).unref?.();
}
