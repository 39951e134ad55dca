// Types of cell-spawn.mjs (plain JavaScript, shared with the launcher runner/bin.mjs).
import type { ChildProcess } from "node:child_process";

export declare const DEFAULT_MEMORY_LIMIT_MB: number;
export declare function memoryLimitMb(env?: NodeJS.ProcessEnv): number;
export declare function cacheRoot(): string;
export declare function latestWorkerFile(): string;
export declare function killGroup(child: ChildProcess): void;
export declare function spawnCellProcess(worker: string, folder: string, limitMb: number): ChildProcess;
export declare function firstNotebookOfRun(argv: readonly string[]): string | undefined;

/** A cell process the launcher started, waiting to be adopted. */
export interface EarlyCellProcess {
  readonly child: ChildProcess;
  readonly worker: string;
  readonly folder: string;
  readonly limitMb: number;
  adopted: boolean;
  failed: boolean;
}
export declare const EARLY_PROCESS: unique symbol;
export declare function startEarlyCellProcess(argv: readonly string[]): void;
export declare const DEFERRED_CA_CERTS: string;
export declare function cellProcessEnv(env?: NodeJS.ProcessEnv): NodeJS.ProcessEnv;
