// The desktop host's printToPdf: Chromium's own print-to-PDF in a hidden window. The page is
// written to a temporary file rather than passed as a data: URL, because Chromium refuses URLs
// over 2 MB and the report of a plan with a couple of hundred populations is larger. The window
// has a session of its own that lets that one file load and cancels every other request, and no
// JavaScript (the report has none).
import { BrowserWindow, session } from 'electron';
import { randomUUID } from 'node:crypto';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

export async function printToPdf(html: string): Promise<Uint8Array> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'plumbline-print-'));
  const file = path.join(dir, 'report.html');
  const url = pathToFileURL(file).href;
  const printSession = session.fromPartition(`plumbline-print-${randomUUID()}`, { cache: false });
  printSession.webRequest.onBeforeRequest((details, callback) => callback({ cancel: details.url !== url }));
  printSession.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  printSession.setPermissionCheckHandler(() => false);
  const hidden = new BrowserWindow({
    show: false,
    webPreferences: { session: printSession, sandbox: true, contextIsolation: true, javascript: false },
  });
  try {
    await writeFile(file, html, 'utf8');
    await hidden.loadURL(url);
    // preferCSSPageSize: the report's @page rule sets the A4 size, the margins and the page-number boxes.
    return await hidden.webContents.printToPDF({
      pageSize: 'A4',
      printBackground: true,
      displayHeaderFooter: false,
      preferCSSPageSize: true,
    });
  } finally {
    hidden.destroy();
    await rm(dir, { recursive: true, force: true });
  }
}
