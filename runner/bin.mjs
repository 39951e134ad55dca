#!/usr/bin/env node
// The `tristim` command: registers tsx so the TypeScript sources run directly (no build step), then starts the CLI.
import { register } from "tsx/esm/api";

register();
const { main } = await import("./cli.ts");
process.exitCode = await main(process.argv.slice(2));
