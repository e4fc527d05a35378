// What handlers may use from their host. The Electron main process and the loopback host each
// build one; handlers never import 'electron' (under plain Node that import tries to download
// the runtime and throws), so the same handlers run in both hosts and in unit tests.

/** A file type a save dialog offers, e.g. { name: 'PDF document', extensions: ['pdf'] }. */
export interface FileFilter {
  readonly name: string;
  readonly extensions: readonly string[];
}

/** Native dialogs exist only in the desktop host; the browser host lacks them. */
export interface Dialogs {
  chooseOpenPath(options: { title: string; defaultPath?: string }): Promise<string | null>;
  /** `filters` narrows the dialog to a file type; plan files when omitted. */
  chooseSavePath(options: { title: string; defaultPath?: string; filters?: readonly FileFilter[] }): Promise<string | null>;
}

export interface HandlerContext {
  readonly appName: string;
  readonly appVersion: string;
  readonly runtime: 'electron' | 'browser';
  /** Per-user folder for recovery files, the recent list and settings. */
  readonly userDataDir: string;
  /** Where plans are saved by default. */
  readonly documentsDir: string;
  /** Folder holding the bundled demo plans. */
  readonly demoDir: string;
  /** Distinguishes this running instance (for "already open elsewhere" checks). */
  readonly instanceId: string;
  readonly dialogs?: Dialogs;
  /** Renders an HTML document to PDF with Chromium's own printing. */
  readonly printToPdf?: (html: string) => Promise<Uint8Array>;
}
