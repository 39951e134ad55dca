/**
 * `--pdf`: prints a written HTML report to `<report>.pdf` with headless Chromium, driven by playwright-core (an npm
 * library that drives an installed browser; it downloads nothing). The system's Chromium is used: CHROMIUM_PATH, or
 * the usual install paths. The page is opened from its file, so it fetches nothing; the PDF is printed after every
 * figure is drawn (`<body data-figures="drawn">`, set by figures-client.js), with the report's print layout (its
 * `@page` size, margins and page numbers). One browser serves every report of a command and is closed at its end.
 */
import fs from "node:fs";
import { createRequire } from "node:module";
import { pathToFileURL } from "node:url";
import type { Browser } from "playwright-core";
import { writeFileAtomic } from "../shared/write-atomic.ts";

/** Where Chromium is looked for, in order, after CHROMIUM_PATH. */
export const CHROMIUM_PATHS = [
  "/usr/bin/chromium",
  "/usr/bin/chromium-browser",
  "/usr/bin/google-chrome",
  "/usr/bin/google-chrome-stable",
  "/Applications/Google Chrome.app/Contents/MacOS/Google Chrome",
  "/Applications/Chromium.app/Contents/MacOS/Chromium",
];

/** Raised when no Chromium can be found or started: says how to install one. */
export class NoChromiumError extends Error {
  override readonly name = "NoChromiumError";
}

export { pdfPathFor } from "./pdf-path.ts";

/** The Chromium executable to use, or undefined. */
export function findChromium(env: NodeJS.ProcessEnv = process.env): string | undefined {
  if (env.CHROMIUM_PATH) return fs.existsSync(env.CHROMIUM_PATH) ? env.CHROMIUM_PATH : undefined;
  return CHROMIUM_PATHS.find((p) => fs.existsSync(p));
}

const INSTALL_HINT =
  "install one (Debian or Ubuntu: sudo apt-get install chromium; Fedora: sudo dnf install chromium; macOS: install Google Chrome) " +
  "or point CHROMIUM_PATH at a Chromium or Chrome executable";

/** The window the report is laid out in before printing, and the print options (the report's own @page rules). */
export const PDF_VIEWPORT = { width: 1000, height: 1200 } as const;
// A4 unless the report's own @page rule names a size (it sets only the margins).
export const PDF_OPTIONS = { format: "A4", preferCSSPageSize: true, printBackground: true } as const;

let browser: Promise<Browser> | undefined;

async function openBrowser(): Promise<Browser> {
  const executablePath = findChromium();
  if (!executablePath)
    throw new NoChromiumError(
      process.env.CHROMIUM_PATH
        ? `CHROMIUM_PATH=${process.env.CHROMIUM_PATH} does not exist; ${INSTALL_HINT}`
        : `--pdf needs Chromium, and none was found (looked for CHROMIUM_PATH, ${CHROMIUM_PATHS.slice(0, 4).join(", ")}); ${INSTALL_HINT}`,
    );
  // Loaded only for --pdf, with require, so the bundled CLI neither carries nor loads it otherwise.
  const { chromium } = createRequire(import.meta.url)("playwright-core") as typeof import("playwright-core");
  try {
    return await chromium.launch({
      executablePath,
      args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking"],
    });
  } catch (e) {
    throw new NoChromiumError(
      `Chromium at ${executablePath} could not be started (${(e as Error).message.split("\n")[0]}); ${INSTALL_HINT}`,
    );
  }
}

/** Prints `report` (an HTML file) to `pdf` once its figures are drawn; throws a NoChromiumError when there is no browser. */
export async function printReportToPdf(report: string, pdf: string): Promise<void> {
  browser ??= openBrowser();
  let opened: Browser;
  try {
    opened = await browser;
  } catch (e) {
    browser = undefined;
    throw e;
  }
  const page = await opened.newPage({ viewport: PDF_VIEWPORT });
  try {
    // Nothing but the report's own file is loaded (reports fetch nothing; this makes sure).
    await page.route(/^(?!file:)/, (route) => route.abort());
    await page.goto(pathToFileURL(report).href, { waitUntil: "load" });
    if ((await page.locator(".plot[data-spec]").count()) > 0)
      await page.waitForSelector("body[data-figures]", { timeout: 120_000 });
    const bytes = await page.pdf(PDF_OPTIONS);
    writeFileAtomic(pdf, [bytes]);
  } finally {
    await page.close();
  }
}

/** Closes the browser, if one was opened. */
export async function closePdfPrinter(): Promise<void> {
  const open = browser;
  browser = undefined;
  if (open) await (await open.catch(() => undefined))?.close();
}
