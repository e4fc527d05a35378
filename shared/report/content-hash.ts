import type { Project } from '../model/project';
import { canonicalJson } from './canonical-json';

/**
 * SHA-256, as lowercase hex, of the project's canonical JSON encoded as UTF-8, computed with Web
 * Crypto (crypto.subtle exists in Node 20 and in every browser, so the app, the browser host and
 * the command line hash alike).
 * @example await planContentHash(project) // "3f0c…" (64 hex digits)
 */
export async function planContentHash(project: Project): Promise<string> {
  const bytes = new TextEncoder().encode(canonicalJson(project));
  const digest = await globalThis.crypto.subtle.digest('SHA-256', bytes);
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
}
