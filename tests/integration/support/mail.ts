// The project's local mail catcher, started in-process on free ports for a test file.
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startMailCatcher } from '../../../scripts/lib/mail-catcher.mjs';

export type CaughtMail = { messageId: string; from: string; to: string[]; subject: string; text: string; date: string };
export type Catcher = { smtpUrl: string; viewerUrl: string; messages: CaughtMail[]; stop: () => Promise<void> };

export const startCatcher = (): Promise<Catcher> => startMailCatcher({ smtpPort: 0, viewerPort: 0 });

/** Waits until `count` messages have arrived (SMTP delivery is asynchronous). */
export async function waitForMail(catcher: Catcher, count: number, timeoutMs = 5000) {
  const started = Date.now();
  while (catcher.messages.length < count) {
    if (Date.now() - started > timeoutMs) throw new Error(`only ${catcher.messages.length} of ${count} messages arrived`);
    await new Promise((r) => setTimeout(r, 50));
  }
  return catcher.messages;
}

/** Waits until a message matching `matches` has arrived, and returns it. */
export async function waitForMessage(catcher: Catcher, matches: (mail: CaughtMail) => boolean, timeoutMs = 5000) {
  const started = Date.now();
  for (;;) {
    const found = catcher.messages.find(matches);
    if (found) return found;
    if (Date.now() - started > timeoutMs) throw new Error(`no matching message among ${catcher.messages.length}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
