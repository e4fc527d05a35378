import type { Api } from '@shared/model/contract';
import type { MenuBridge } from '@shared/model/channels';

declare global {
  interface Window {
    /** Exposed by the preload (desktop) or the loopback host's stand-in script (browser). */
    readonly api: Api;
    /** Menu commands from the desktop host; absent in the browser host. */
    readonly plumblineMenu?: MenuBridge;
  }
}
export {};
