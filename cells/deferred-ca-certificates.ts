/**
 * NODE_EXTRA_CA_CERTS in the cell process, read while it starts but parsed only when a cell first makes a TLS
 * context. The runner hands the variable over under another name (cellProcessEnv in runner/execute/cell-spawn.mjs),
 * so that Node does not parse the file before the harness even loads; this puts it back, for the cells and the
 * processes they start, and gives every TLS context made without its own `ca` the extra certificates, as Node adds
 * them to its default root store. A context with `ca` of its own does not get them, as in Node.
 *
 * Only the certificates that Node's bundled roots do not already hold are added: a file that is a whole system bundle
 * (140 certificates, mostly the same roots) would otherwise be parsed again for every connection, 20 ms each.
 */
import fs from "node:fs";
import { createRequire, syncBuiltinESMExports } from "node:module";

/** The variable cellProcessEnv hands NODE_EXTRA_CA_CERTS over in (the same name as DEFERRED_CA_CERTS there). */
export const DEFERRED_CA_CERTS = "TRISTIM_DEFERRED_CA_CERTS";

const PEM_BLOCK = /-----BEGIN ([A-Z0-9 ]+)-----[\s\S]*?-----END \1-----/g;

/** The body of a PEM block without its line breaks, to compare certificates however the file wraps them. */
function pemBody(block: string): string {
  return block.replace(/-----[A-Z0-9 ]+-----|\s/g, "");
}

/**
 * The PEM blocks of a certificate file that are not among `known` (PEM certificates, as tls.rootCertificates lists
 * Node's bundled roots), joined as one PEM text; blocks other than plain CERTIFICATE (e.g. TRUSTED CERTIFICATE) are
 * kept as they are.
 */
export function certificatesBeyond(fileText: string, known: readonly string[]): string {
  const knownBodies = new Set(known.map(pemBody));
  const extra: string[] = [];
  for (const match of fileText.matchAll(PEM_BLOCK)) {
    if (match[1] === "CERTIFICATE" && knownBodies.has(pemBody(match[0]))) continue;
    extra.push(match[0]);
  }
  return extra.join("\n");
}

/** Node's native TLS context (its `ca` option and its default roots call these methods). */
interface NativeSecureContext {
  addRootCerts(): void;
  addCACert(pem: string): void;
}

/** The prototype of Node's native SecureContext, if this Node still shows it (Node 20 does, to process.binding). */
function nativeSecureContext(): NativeSecureContext | null {
  try {
    const binding = (process as unknown as { binding(name: string): Record<string, unknown> }).binding(
      "crypto",
    );
    const prototype = (binding.SecureContext as { prototype?: Partial<NativeSecureContext> } | undefined)
      ?.prototype;
    return typeof prototype?.addRootCerts === "function" && typeof prototype.addCACert === "function"
      ? (prototype as NativeSecureContext)
      : null;
  } catch {
    return null;
  }
}

/**
 * Puts NODE_EXTRA_CA_CERTS back from DEFERRED_CA_CERTS and makes TLS contexts trust its certificates. The file is
 * read now, as Node reads it at start-up (so that no read of it by a later cell's code is seen as the notebook's);
 * an unreadable file is ignored, as Node ignores it.
 *
 * Node gives a context its default roots through the native addRootCerts, for every context made without `ca`
 * (https, fetch, tls.connect, servers): that method, wrapped, adds the file's certificates after them, and loading
 * the tls module (20 ms) waits until a cell needs it. Where Node does not show that method, tls.createSecureContext
 * is wrapped instead, which loads tls now.
 */
export function installDeferredCaCertificates(
  env: NodeJS.ProcessEnv = process.env,
  given?: NativeSecureContext | null,
): void {
  const file = env[DEFERRED_CA_CERTS];
  if (!file) return;
  // Looked up only here: without the variable, the harness's start does not touch the binding.
  const native = given === undefined ? nativeSecureContext() : given;
  delete env[DEFERRED_CA_CERTS];
  env.NODE_EXTRA_CA_CERTS = file;
  let text: string;
  try {
    text = fs.readFileSync(file, "utf8");
  } catch {
    return;
  }
  const load = createRequire(import.meta.url);
  let extra: string | undefined;
  // Computed at the first context, when tls is loaded anyway.
  const extraCertificates = (): string =>
    (extra ??= certificatesBeyond(text, (load("node:tls") as typeof import("node:tls")).rootCertificates));
  if (native) {
    const addRootCerts = native.addRootCerts;
    native.addRootCerts = function (this: NativeSecureContext) {
      addRootCerts.call(this);
      const pem = extraCertificates();
      if (pem !== "") this.addCACert(pem);
    };
    return;
  }
  const tls = load("node:tls") as typeof import("node:tls");
  const original = tls.createSecureContext;
  tls.createSecureContext = function createSecureContext(options?: import("node:tls").SecureContextOptions) {
    const context = original(options);
    if (!options?.ca) {
      const pem = extraCertificates();
      if (pem !== "") (context as unknown as { context: NativeSecureContext }).context.addCACert(pem);
    }
    return context;
  };
  syncBuiltinESMExports();
}
