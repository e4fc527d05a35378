// PDF through Chromium's own print-to-PDF, for the hosts that have no Electron webContents (the
// browser host and the command line): Debian's Chromium run headless on the report page, with a
// fresh profile in a temporary folder that is removed afterwards. CHROMIUM_PATH overrides where
// Chromium is looked for.
import { spawn } from 'node:child_process';
import { constants } from 'node:fs';
import { access, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

/** Where Chromium or Chrome usually lives, tried in order when CHROMIUM_PATH is not set. */
export const CHROMIUM_CANDIDATES: readonly string[] = [
  '/usr/bin/chromium',
  '/usr/bin/chromium-browser',
  '/usr/bin/google-chrome',
  '/usr/bin/google-chrome-stable',
  '/Applications/Chromium.app/Contents/MacOS/Chromium',
  '/Applications/Google Chrome.app/Contents/MacOS/Google Chrome',
  'C:\\Program Files\\Google\\Chrome\\Application\\chrome.exe',
  'C:\\Program Files (x86)\\Google\\Chrome\\Application\\chrome.exe',
];

/** How long one print may take before Chromium is stopped. */
export const PRINT_TIMEOUT_MS = 90_000;

/** PDF printing is not possible here (no Chromium, or Chromium failed); the message says why. */
export class PdfUnavailableError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PdfUnavailableError';
  }
}

async function isExecutable(file: string): Promise<boolean> {
  try {
    await access(file, process.platform === 'win32' ? constants.F_OK : constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

/** The Chromium to print with: CHROMIUM_PATH when set (it must exist), else the first candidate found. */
export async function findChromium(env: NodeJS.ProcessEnv = process.env): Promise<string> {
  const chosen = env['CHROMIUM_PATH']?.trim();
  if (chosen !== undefined && chosen !== '') {
    if (await isExecutable(chosen)) return chosen;
    throw new PdfUnavailableError(`CHROMIUM_PATH is set to "${chosen}", but no runnable program is there.`);
  }
  for (const candidate of CHROMIUM_CANDIDATES) if (await isExecutable(candidate)) return candidate;
  throw new PdfUnavailableError(
    'No Chromium was found to print the PDF (looked for /usr/bin/chromium and the usual Chrome locations). ' +
      'Install it (on Debian: apt-get install chromium) or set CHROMIUM_PATH to its program; the Markdown report works without it.',
  );
}

/** The command-line switches: headless, no first-run work, no network services, print without Chromium's own header and footer. */
export function chromiumArguments(profileDir: string, pdfPath: string, htmlPath: string): string[] {
  return [
    '--headless',
    '--no-sandbox',
    '--disable-gpu',
    '--no-pdf-header-footer',
    `--user-data-dir=${profileDir}`,
    '--no-first-run',
    '--no-default-browser-check',
    '--disable-extensions',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    `--print-to-pdf=${pdfPath}`,
    pathToFileURL(htmlPath).href,
  ];
}

/** The last lines Chromium wrote to stderr, without the D-Bus noise of headless runs. */
function tail(stderr: string): string {
  return stderr
    .split('\n')
    .filter((line) => line.trim() !== '' && !/dbus|Fontconfig/i.test(line))
    .slice(-4)
    .join('\n');
}

function run(
  program: string,
  args: readonly string[],
  timeoutMs: number,
): Promise<{ code: number | null; stderr: string; timedOut: boolean }> {
  return new Promise((resolve, reject) => {
    // Its own process group, so a stuck print can be stopped together with Chromium's helpers.
    const child = spawn(program, args, { stdio: ['ignore', 'ignore', 'pipe'], detached: process.platform !== 'win32' });
    let stderr = '';
    let timedOut = false;
    child.stderr.setEncoding('utf8');
    child.stderr.on('data', (chunk: string) => {
      stderr = (stderr + chunk).slice(-8192);
    });
    const timer = setTimeout(() => {
      timedOut = true;
      try {
        if (process.platform !== 'win32' && child.pid !== undefined) process.kill(-child.pid, 'SIGKILL');
        else child.kill('SIGKILL');
      } catch {
        // Already gone.
      }
    }, timeoutMs);
    child.on('error', (error) => {
      clearTimeout(timer);
      reject(new PdfUnavailableError(`Chromium (${program}) could not be started: ${error.message}`));
    });
    child.on('close', (code) => {
      clearTimeout(timer);
      resolve({ code, stderr, timedOut });
    });
  });
}

export interface ChromiumPrintOptions {
  readonly env?: NodeJS.ProcessEnv;
  readonly timeoutMs?: number;
}

/**
 * Prints an HTML page to PDF with headless Chromium and returns the PDF's bytes. The page is
 * written to a temporary folder (with the profile and the PDF), which is always removed.
 * Throws PdfUnavailableError with the reason when Chromium is missing, fails or times out.
 */
export async function printHtmlWithChromium(html: string, options: ChromiumPrintOptions = {}): Promise<Uint8Array> {
  const program = await findChromium(options.env);
  const dir = await mkdtemp(path.join(os.tmpdir(), 'plumbline-pdf-'));
  try {
    const htmlPath = path.join(dir, 'report.html');
    const pdfPath = path.join(dir, 'report.pdf');
    await writeFile(htmlPath, html, 'utf8');
    const timeoutMs = options.timeoutMs ?? PRINT_TIMEOUT_MS;
    const result = await run(program, chromiumArguments(path.join(dir, 'profile'), pdfPath, htmlPath), timeoutMs);
    if (result.timedOut)
      throw new PdfUnavailableError(`Chromium did not finish printing within ${Math.round(timeoutMs / 1000)} s and was stopped.`);
    let pdf: Buffer;
    try {
      pdf = await readFile(pdfPath);
    } catch {
      const detail = tail(result.stderr);
      throw new PdfUnavailableError(
        `Chromium (exit status ${String(result.code)}) wrote no PDF.${detail === '' ? '' : ` It said:\n${detail}`}`,
      );
    }
    if (pdf.subarray(0, 5).toString('latin1') !== '%PDF-')
      throw new PdfUnavailableError('Chromium wrote a file that is not a PDF.');
    return new Uint8Array(pdf);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** A printToPdf for a host context (the browser host, the end-to-end harness, the command line). */
export function chromiumPrinter(options: ChromiumPrintOptions = {}): (html: string) => Promise<Uint8Array> {
  return (html) => printHtmlWithChromium(html, options);
}
