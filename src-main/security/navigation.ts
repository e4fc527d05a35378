// Pure guards used by the Electron window (and tested with tables of hostile inputs):
// the renderer may only ever show the app's own pages.

/** The scheme and host the desktop app serves its renderer from. */
export const APP_ORIGIN = 'app://plumbline';

/** True only for URLs on the app's own origin; everything else (http, file, data, javascript…) is refused. */
export function isAppUrl(url: string, origin: string = APP_ORIGIN): boolean {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return false;
  }
  if (parsed.username !== '' || parsed.password !== '') return false;
  return `${parsed.protocol}//${parsed.host}` === origin;
}

/** Permission requests (camera, geolocation, notifications, …) are all denied. */
export function allowPermission(_permission: string): boolean {
  return false;
}

/** Options for every BrowserWindow: the security baseline in one place. */
export function secureWebPreferences(preloadPath: string) {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    navigateOnDragDrop: false,
    spellcheck: false,
    safeDialogs: true,
  } as const;
}
