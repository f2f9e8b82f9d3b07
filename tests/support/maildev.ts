/** Reads the local mail catcher (maildev) through its REST API. */
export type CaughtMail = { id: string; subject: string; text: string; to: { address: string }[] };

const api = () => process.env.MAILDEV_API ?? "http://127.0.0.1:2581";

export async function waitForMail(to: string, subject: RegExp, timeoutMs = 20_000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await fetch(`${api()}/api/email`);
    if (res.ok) {
      const all = (await res.json()) as CaughtMail[];
      const hit = all.find((m) => m.to.some((t) => t.address.toLowerCase() === to.toLowerCase()) && subject.test(m.subject));
      if (hit) return hit;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no mail to ${to} matching ${subject} within ${timeoutMs} ms`);
}

export async function mailsTo(to: string): Promise<CaughtMail[]> {
  const all = (await (await fetch(`${api()}/api/email`)).json()) as CaughtMail[];
  return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === to.toLowerCase()));
}

export function firstLink(text: string): string {
  const m = /https?:\/\/\S+/.exec(text);
  if (!m) throw new Error("no link in the message");
  return m[0];
}
