// The channel names of the IPC contract, and nothing else. Dependency-free on purpose: the
// sandboxed preload imports this file and may not import zod or anything with dependencies.
// shared/model/contract.ts maps every name here to its request and response schema; a unit test
// checks that the two lists are the same.
export const CHANNELS = [
  'appInfo',
  'loadDemo',
  'openPlan',
  'revertPlan',
  'peekPlan',
  'savePlan',
  'closePlan',
  'autosave',
  'listRecovery',
  'restoreRecovery',
  'discardRecovery',
  'recentPlans',
  'forgetRecent',
  'importPopulations',
  'exportPopulation',
  'chooseFile',
  'listFolder',
  'exportReport',
  'exportTable',
] as const;

export type Channel = (typeof CHANNELS)[number];

/** The result every channel answers with: thrown errors lose their code on the way back. */
export type Envelope<T> =
  | { readonly ok: true; readonly value: T }
  | { readonly ok: false; readonly error: { readonly code: string; readonly message: string } };

/** The bridge the preload (or the browser stand-in) exposes: one named method per channel. */
export type RawBridge = { readonly [C in Channel]: (request: unknown) => Promise<unknown> };

/** Builds the bridge object from a transport; used by the preload and the browser stand-in. */
export function buildBridge(send: (channel: Channel, request: unknown) => Promise<unknown>): RawBridge {
  const bridge: Partial<Record<Channel, (request: unknown) => Promise<unknown>>> = {};
  for (const channel of CHANNELS) bridge[channel] = (request: unknown) => send(channel, request);
  return Object.freeze(bridge) as RawBridge;
}

/** Commands the desktop menu sends to the page, which owns the document state. */
export const MENU_COMMANDS = ['new', 'new-demo', 'open', 'save', 'save-as', 'revert', 'undo', 'redo', 'about'] as const;
export type MenuCommand = (typeof MENU_COMMANDS)[number];

/** The event channel the menu commands travel on (main → page only). */
export const MENU_EVENT = 'menu-command';

export function isMenuCommand(value: unknown): value is MenuCommand {
  return typeof value === 'string' && (MENU_COMMANDS as readonly string[]).includes(value);
}

/** What the preload exposes besides the API: a subscription to menu commands (desktop only). */
export interface MenuBridge {
  readonly onCommand: (listener: (command: MenuCommand) => void) => () => void;
}
