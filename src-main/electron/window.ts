import { BrowserWindow } from 'electron';
import { APP_ORIGIN, isAppUrl, secureWebPreferences } from '../security/navigation';

/** Opens a window with the security baseline: isolated, sandboxed, no Node, no navigation away. */
export function createMainWindow(preloadPath: string): BrowserWindow {
  const window = new BrowserWindow({
    width: 1400,
    height: 900,
    minWidth: 900,
    minHeight: 600,
    title: 'Plumbline',
    show: false,
    webPreferences: secureWebPreferences(preloadPath),
  });
  window.once('ready-to-show', () => window.show());
  // No new windows, ever: the app has no external links and makes no network requests.
  window.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
  window.webContents.on('will-navigate', (event, url) => {
    if (!isAppUrl(url)) event.preventDefault();
  });
  window.webContents.on('will-redirect', (event, url) => {
    if (!isAppUrl(url)) event.preventDefault();
  });
  window.webContents.on('will-attach-webview', (event) => event.preventDefault());
  void window.loadURL(`${APP_ORIGIN}/index.html`);
  return window;
}
