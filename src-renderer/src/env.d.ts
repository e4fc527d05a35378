import type { Api } from '@shared/model/contract';

declare global {
  interface Window {
    /** Exposed by the preload (desktop) or the loopback host's stand-in script (browser). */
    readonly api: Api;
  }
}
export {};
