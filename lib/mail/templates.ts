/** Ampwright's messages, plain text first (shop inboxes often show only that), with a simple HTML part. */
export type Message = { subject: string; text: string; html: string };

const esc = (s: string) => s.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c] as string);

function wrap(lines: string[], link: { url: string; label: string }): string {
  return `<div style="font-family:sans-serif;max-width:560px">${lines.map((l) => `<p>${esc(l)}</p>`).join("")}<p><a href="${esc(link.url)}" style="background:#a65a24;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${esc(link.label)}</a></p><p style="color:#68737d;font-size:12px">${esc(link.url)}</p></div>`;
}

export function verificationMessage(name: string, url: string): Message {
  const lines = [`Hello ${name},`, "Confirm this address to finish setting up your Ampwright account. The link works for one hour."];
  return { subject: "Confirm your e-mail address for Ampwright", text: `${lines.join("\n\n")}\n\n${url}\n`, html: wrap(lines, { url, label: "Confirm my address" }) };
}

export function resetMessage(name: string, url: string): Message {
  const lines = [`Hello ${name},`, "Someone asked to reset the password of your Ampwright account. If it was you, choose a new one with the link below; it works for one hour. If it was not, ignore this message: nothing changes."];
  return { subject: "Reset your Ampwright password", text: `${lines.join("\n\n")}\n\n${url}\n`, html: wrap(lines, { url, label: "Choose a new password" }) };
}

/** Told to an account's owner when wrong passwords have locked it for a while. */
export function signInLockedMessage(p: { name: string; failures: number; minutes: number; resetUrl: string }): Message {
  const lines = [
    `Hello ${p.name},`,
    `Someone has tried to sign in to your Ampwright account with a wrong password ${p.failures} times in a row, so signing in with a password is paused for ${p.minutes} minutes.`,
    "If it was you, wait and try again, or choose a new password with the link below. If it was not, choose a new password now: that also signs out every other session.",
  ];
  return { subject: "Sign-in to your Ampwright account is paused", text: `${lines.join("\n\n")}\n\n${p.resetUrl}\n`, html: wrap(lines, { url: p.resetUrl, label: "Choose a new password" }) };
}

/**
 * A name someone typed, made safe to put in mail sent to a stranger: one line, at most `max` characters, and
 * nothing a mail program would turn into a link ("example.com" becomes "example[.]com", "://" goes).
 */
export function inertName(name: string, max = 60): string {
  let s = name.replace(/[\u0000-\u001f\u007f-\u009f]/g, " ").replace(/\s+/g, " ").trim();
  s = s.replace(/:\/\//g, " ").replace(/([\p{L}\p{N}_-])\.(?=[\p{L}\p{N}_-])/gu, "$1[.]").replace(/@/g, " at ");
  s = s.replace(/\s+/g, " ").trim();
  return s.length > max ? `${s.slice(0, max - 1).trimEnd()}…` : s;
}

export function invitationMessage(raw: { inviter: string; organization: string; roleLabel: string; url: string; days: number }): Message {
  const p = { ...raw, inviter: inertName(raw.inviter), organization: inertName(raw.organization) };
  const lines = [
    `${p.inviter} invites you to join ${p.organization} on Ampwright as ${p.roleLabel}.`,
    `Follow the link to accept; you can sign in or create an account on the way. The invitation expires in ${p.days} days.`,
  ];
  return { subject: `Join ${p.organization} on Ampwright`, text: `${lines.join("\n\n")}\n\n${p.url}\n`, html: wrap(lines, { url: p.url, label: "Accept the invitation" }) };
}

/** A job report sent from the job page: a note from the sender, the report in brief, the PDF attached. */
export function reportMessage(p: { sender: string; organization: string; title: string; note: string; summary: string; url?: string }): Message {
  const lines = [`${p.sender} of ${p.organization} sent you the report of a job: ${p.title}.`, ...(p.note ? [p.note] : []), "The full report is attached as a PDF."];
  const text = `${lines.join("\n\n")}\n\n${p.summary}\n`;
  const summary = `<pre style="font-family:inherit;white-space:pre-wrap;border-top:1px solid #d0d7de;padding-top:12px">${esc(p.summary)}</pre>`;
  const html = p.url
    ? wrap(lines, { url: p.url, label: "Open the report" }).replace(/<\/div>$/, `${summary}</div>`)
    : `<div style="font-family:sans-serif;max-width:560px">${lines.map((l) => `<p>${esc(l)}</p>`).join("")}${summary}</div>`;
  return { subject: `Report: ${p.title}`, text, html };
}
