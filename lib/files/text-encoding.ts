/**
 * Turning a file's bytes into text as instruments write it: a byte-order mark names UTF-8, UTF-16 LE or UTF-16 BE
 * (Unicode Standard §23.8); without one the bytes are read as UTF-8 when they are valid UTF-8, else as
 * Windows-1252 (the WHATWG Encoding Standard's decoder for the "latin1" label), and that choice is reported.
 */
import { Buffer, isUtf8 } from "node:buffer";
import { DataFileError } from "./data-file-error.ts";

/** The text encodings a measurement file may be read in. */
export const TEXT_ENCODINGS = ["utf-8", "utf-16le", "utf-16be", "windows-1252"] as const;
export type TextEncoding = (typeof TEXT_ENCODINGS)[number];

export interface DecodedText {
  readonly text: string;
  readonly encoding: TextEncoding;
  /** A sentence saying how the encoding was decided; undefined when the caller stated it. */
  readonly inferred: string | undefined;
}

/** The text of a file's bytes in the stated encoding, or the one its byte-order mark or its bytes show. */
export function decodeMeasurementText(
  bytes: Uint8Array,
  stated: TextEncoding | "auto" = "auto",
): DecodedText {
  if (!(bytes instanceof Uint8Array))
    throw new DataFileError(`expected the file's bytes (a Uint8Array or Buffer), got ${typeof bytes}`);
  if (stated !== "auto" && !(TEXT_ENCODINGS as readonly string[]).includes(stated))
    throw new DataFileError(
      `encoding ${JSON.stringify(stated)} is not one of ${[...TEXT_ENCODINGS, "auto"].map((e) => JSON.stringify(e)).join(", ")}`,
    );
  const b0 = bytes[0],
    b1 = bytes[1],
    b2 = bytes[2];
  let bom: TextEncoding | undefined;
  if (b0 === 0xef && b1 === 0xbb && b2 === 0xbf) bom = "utf-8";
  else if (b0 === 0xff && b1 === 0xfe) bom = "utf-16le";
  else if (b0 === 0xfe && b1 === 0xff) bom = "utf-16be";
  if (stated !== "auto") {
    const text = new TextDecoder(stated, { fatal: stated !== "windows-1252" }).decode(bytes);
    return { text: stripBom(text), encoding: stated, inferred: undefined };
  }
  if (bom !== undefined) {
    const text = new TextDecoder(bom).decode(bytes);
    return {
      text: stripBom(text),
      encoding: bom,
      inferred: `The text encoding (${ENCODING_NAMES[bom]}) was taken from the file's byte-order mark.`,
    };
  }
  // UTF-16 without a byte-order mark: ASCII text then has a zero byte beside every character.
  if (bytes.length >= 4 && b0 !== 0 && b1 === 0 && b2 !== 0 && bytes[3] === 0) {
    return {
      text: stripBom(new TextDecoder("utf-16le").decode(bytes)),
      encoding: "utf-16le",
      inferred:
        "The text encoding (UTF-16 little-endian) was inferred from the zero bytes beside each character; the file has no byte-order mark (state encoding to override).",
    };
  }
  if (bytes.length >= 4 && b0 === 0 && b1 !== 0 && b2 === 0 && bytes[3] !== 0) {
    return {
      text: stripBom(new TextDecoder("utf-16be").decode(bytes)),
      encoding: "utf-16be",
      inferred:
        "The text encoding (UTF-16 big-endian) was inferred from the zero bytes beside each character; the file has no byte-order mark (state encoding to override).",
    };
  }
  if (isUtf8(bytes)) {
    const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("utf8");
    return {
      text,
      encoding: "utf-8",
      inferred: `The text encoding (UTF-8) was inferred: the bytes are valid UTF-8 and there is no byte-order mark.`,
    };
  } else {
    const text = new TextDecoder("windows-1252").decode(bytes);
    return {
      text,
      encoding: "windows-1252",
      inferred: `The text encoding (Windows-1252, a superset of Latin-1) was inferred because the bytes are not valid UTF-8 (state encoding to override).`,
    };
  }
}

const ENCODING_NAMES: Record<TextEncoding, string> = {
  "utf-8": "UTF-8",
  "utf-16le": "UTF-16 little-endian",
  "utf-16be": "UTF-16 big-endian",
  "windows-1252": "Windows-1252",
};

function stripBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}
