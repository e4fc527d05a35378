// Electron main process: a thin host. It builds the handler context, registers one ipcMain
// handler per contract channel through dispatch(), serves the renderer from app://, and denies
// everything a clinical machine would not want a desktop app to do (network, new windows,
// navigation, permissions).
import type { BrowserWindow } from 'electron';
import { app, dialog, ipcMain, Menu, session } from 'electron';
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { CHANNELS, MENU_EVENT } from '@shared/model/channels';
import { APP_NAME, APP_VERSION } from './app-meta';
import { dispatch } from './handlers/dispatch';
import type { HandlerContext } from './handlers/context';
import { buildMenu } from './electron/menu';
import { printToPdf } from './electron/print-to-pdf';
import { registerAppScheme, serveRenderer } from './electron/protocol';
import { createMainWindow } from './electron/window';
import { allowPermission, isAppUrl } from './security/navigation';

registerAppScheme();

let mainWindow: BrowserWindow | null = null;

void app.whenReady().then(() => {
  const appRoot = app.getAppPath();
  const ctx: HandlerContext = {
    appName: APP_NAME,
    appVersion: APP_VERSION,
    runtime: 'electron',
    userDataDir: app.getPath('userData'),
    documentsDir: app.getPath('documents'),
    demoDir: path.join(appRoot, 'demo'),
    instanceId: randomUUID(),
    printToPdf,
    dialogs: {
      async chooseOpenPath({ title, defaultPath }) {
        const options = {
          title,
          properties: ['openFile' as const],
          filters: [{ name: 'Plumbline plan', extensions: ['plumb'] }],
          ...(defaultPath ? { defaultPath } : {}),
        };
        const result = mainWindow ? await dialog.showOpenDialog(mainWindow, options) : await dialog.showOpenDialog(options);
        return result.canceled ? null : (result.filePaths[0] ?? null);
      },
      async chooseSavePath({ title, defaultPath, filters }) {
        const options = {
          title,
          filters: filters?.map((f) => ({ name: f.name, extensions: [...f.extensions] })) ?? [
            { name: 'Plumbline plan', extensions: ['plumb'] },
          ],
          ...(defaultPath ? { defaultPath } : {}),
        };
        const result = mainWindow ? await dialog.showSaveDialog(mainWindow, options) : await dialog.showSaveDialog(options);
        return result.canceled ? null : (result.filePath ?? null);
      },
    },
  };

  // No network: every request that is not for the app's own pages is cancelled.
  session.defaultSession.webRequest.onBeforeRequest((details, callback) => {
    callback({ cancel: !(isAppUrl(details.url) || details.url.startsWith('devtools://') || details.url.startsWith('data:')) });
  });
  session.defaultSession.setPermissionRequestHandler((_contents, permission, callback) => callback(allowPermission(permission)));
  session.defaultSession.setPermissionCheckHandler((_contents, permission) => allowPermission(permission));

  serveRenderer(path.join(import.meta.dirname, '../renderer'));
  for (const channel of CHANNELS) {
    ipcMain.handle(channel, (event, payload: unknown) => {
      if (!isAppUrl(event.senderFrame?.url ?? ''))
        return { ok: false, error: { code: 'forbidden', message: 'Calls are accepted from the app only.' } };
      return dispatch(channel, payload, ctx);
    });
  }

  mainWindow = createMainWindow(path.join(import.meta.dirname, '../preload/index.cjs'));
  Menu.setApplicationMenu(
    buildMenu(
      () => mainWindow,
      (command) => mainWindow?.webContents.send(MENU_EVENT, command),
    ),
  );
  mainWindow.on('closed', () => {
    mainWindow = null;
  });
});

app.on('web-contents-created', (_event, contents) => {
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
});

app.on('window-all-closed', () => app.quit());
