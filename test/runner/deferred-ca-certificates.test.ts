/**
 * NODE_EXTRA_CA_CERTS in cells: the runner hands it to the cell process under another name, so that Node does not
 * parse the file while the process starts (runner/execute/cell-spawn.mjs), and the harness gives TLS contexts its
 * certificates when a cell makes one (cells/deferred-ca-certificates.ts). What a cell trusts must be what Node
 * trusts with the variable set (Node's documentation of NODE_EXTRA_CA_CERTS: the well-known roots extended with the
 * file's certificates, not used for a context given a `ca` of its own). The server is on 127.0.0.1, with the
 * self-signed certificate in tls-fixture/.
 */
import fs from "node:fs";
import https from "node:https";
import type { AddressInfo } from "node:net";
import path from "node:path";
import tls from "node:tls";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { syncBuiltinESMExports } from "node:module";
import {
  certificatesBeyond,
  DEFERRED_CA_CERTS,
  installDeferredCaCertificates,
} from "../../cells/deferred-ca-certificates.ts";
import { cellProcessEnv, DEFERRED_CA_CERTS as SPAWN_NAME } from "../../runner/execute/cell-spawn.mjs";
import { tristimCommand } from "./bad-input-helpers.ts";
import { notebookFile, ts } from "./helpers.ts";

const FIXTURE = fileURLToPath(new URL("./tls-fixture/", import.meta.url));
const CERT = path.join(FIXTURE, "localhost-cert.pem");
const KEY = path.join(FIXTURE, "localhost-key.pem");

describe("the environment of the cell process", () => {
  it("hands NODE_EXTRA_CA_CERTS over under the name the harness reads, and leaves it alone when unset", () => {
    expect(SPAWN_NAME).toBe(DEFERRED_CA_CERTS);
    const withCerts = cellProcessEnv({ PATH: "/bin", NODE_EXTRA_CA_CERTS: CERT });
    // Deferred on Node 20 only (where it was tested); elsewhere the variable goes through as it is.
    const deferred = process.versions.node.startsWith("20.");
    expect(withCerts.NODE_EXTRA_CA_CERTS).toBe(deferred ? undefined : CERT);
    expect(withCerts[DEFERRED_CA_CERTS]).toBe(deferred ? CERT : undefined);
    expect(withCerts.PATH).toBe("/bin");
    const without = cellProcessEnv({ PATH: "/bin", NODE_EXTRA_CA_CERTS: "" });
    expect(without[DEFERRED_CA_CERTS]).toBeUndefined();
  });
});

describe("certificatesBeyond", () => {
  it("drops the certificates Node's bundled roots hold, however the file wraps them, and keeps the others", () => {
    const root = tls.rootCertificates[0]!;
    // The same certificate as a system bundle might write it: other line length, comments around it.
    const body = root.replace(/-----[A-Z ]+-----|\s/g, "");
    const rewrapped = `-----BEGIN CERTIFICATE-----\n${body.match(/.{1,76}/g)!.join("\n")}\n-----END CERTIFICATE-----`;
    const own = fs.readFileSync(CERT, "utf8").trim();
    const trusted = own
      .replaceAll("BEGIN CERTIFICATE", "BEGIN TRUSTED CERTIFICATE")
      .replaceAll("END CERTIFICATE", "END TRUSTED CERTIFICATE");
    const file = `# a root Node has\n${rewrapped}\n\n# our own\n${own}\n${trusted}\n`;
    expect(certificatesBeyond(file, tls.rootCertificates)).toBe(`${own}\n${trusted}`);
    expect(certificatesBeyond(rewrapped, tls.rootCertificates)).toBe("");
  });
});

describe("a cell's TLS with NODE_EXTRA_CA_CERTS", () => {
  let server: https.Server;
  let url: string;
  beforeAll(async () => {
    server = https.createServer({ key: fs.readFileSync(KEY), cert: fs.readFileSync(CERT) }, (_, res) =>
      res.end("served"),
    );
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    // By address (the certificate names 127.0.0.1 too): "localhost" may resolve to ::1 first on another machine.
    url = `https://127.0.0.1:${(server.address() as AddressInfo).port}/`;
  });
  afterAll(() => server.close());

  const CELL = ts(
    [
      'import fs from "node:fs";',
      'import https from "node:https";',
      'import tls from "node:tls";',
      "const url = process.env.TEST_URL!;",
      'const failed = (e: any) => "failed: " + (e?.cause?.code ?? e?.code ?? e?.message);',
      "const viaFetch = await fetch(url).then((r) => r.text(), failed);",
      "const get = (options: https.RequestOptions) => new Promise<string>((resolve) =>",
      '  https.get(url, options, (r) => { let b = ""; r.on("data", (c) => (b += c)); r.on("end", () => resolve(b)); })',
      '    .on("error", (e) => resolve(failed(e))));',
      "const viaHttps = await get({ agent: false });",
      "const ownCa = await get({ agent: false, ca: [...tls.rootCertificates] });",
      'fs.writeFileSync("seen.json", JSON.stringify({ viaFetch, viaHttps, ownCa,',
      `  extra: process.env.NODE_EXTRA_CA_CERTS ?? null, deferred: process.env.${DEFERRED_CA_CERTS} ?? null }));`,
    ].join("\n"),
  );

  async function run(extra: string): Promise<Record<string, string | null>> {
    const file = notebookFile(`# TLS in a cell (invented)\n\n${CELL}`);
    const result = await tristimCommand(["run", file, "--quiet"], 120_000, {
      TEST_URL: url,
      NODE_EXTRA_CA_CERTS: extra,
    });
    expect(result.code, result.err).toBe(0);
    return JSON.parse(fs.readFileSync(path.join(path.dirname(file), "seen.json"), "utf8"));
  }

  it("trusts the file's certificates for fetch and https, and shows the cell the variable as it was set", async () => {
    const seen = await run(CERT);
    expect(seen.viaFetch).toBe("served");
    expect(seen.viaHttps).toBe("served");
    expect(seen.extra).toBe(CERT);
    expect(seen.deferred).toBeNull();
  });

  it("does not give them to a context with a ca of its own, as Node does not", async () => {
    const seen = await run(CERT);
    expect(seen.ownCa).toMatch(/^failed: .*SELF_SIGNED/);
  });

  it("where Node does not show its native context, trusts them through tls.createSecureContext", async () => {
    const original = tls.createSecureContext;
    const before = await fetch(url).then(
      (r) => r.text(),
      (e: { cause?: { code?: string } }) => e.cause?.code,
    );
    const env: NodeJS.ProcessEnv = { [DEFERRED_CA_CERTS]: CERT };
    try {
      installDeferredCaCertificates(env, null);
      expect(env).toEqual({ NODE_EXTRA_CA_CERTS: CERT });
      // A new agent: the global one may keep a connection from before.
      const body = await new Promise<string>((resolve, reject) =>
        https
          .get(url, { agent: false }, (r) => {
            let b = "";
            r.on("data", (c) => (b += c));
            r.on("end", () => resolve(b));
          })
          .on("error", reject),
      );
      expect(before).toMatch(/SELF_SIGNED/);
      expect(body).toBe("served");
    } finally {
      tls.createSecureContext = original;
      syncBuiltinESMExports();
    }
  });

  it("trusts nothing more without the variable (the server's certificate is self-signed)", async () => {
    const seen = await run("");
    expect(seen.viaFetch).toMatch(/^failed: .*SELF_SIGNED/);
    expect(seen.viaHttps).toMatch(/^failed: .*SELF_SIGNED/);
  });
});
