import type { Reproducibility } from './document';

/** What the reproducibility footer says, one fact per line (every renderer prints these). */
export function reproducibilityLines(r: Reproducibility): string[] {
  return [
    `Made with ${r.appName} ${r.appVersion} on ${r.date}.`,
    `Plan file: ${r.fileName ?? 'not saved yet'}.`,
    `SHA-256 of the plan’s canonical JSON (keys sorted, no spaces, defaults filled in): ${r.contentHash}.`,
  ];
}

/** The short form printed at the foot of every page. */
export function reproducibilityFootline(r: Reproducibility): string {
  return `${r.appName} ${r.appVersion} · ${r.fileName ?? 'unsaved plan'} · SHA-256 ${r.contentHash.slice(0, 16)}…`;
}
