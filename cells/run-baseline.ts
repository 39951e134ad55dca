/**
 * The process-wide state a run can change, recorded when the cell process is ready and put back after a run, so
 * that the next run of a batch can use the same process as if it were new (runner/execute/cell-process.ts hands a
 * process on only when `restoreBaseline` says it is clean).
 *
 * What is put back: the global object's properties (the cells' shared bindings, globals they set or replaced); the
 * own properties of the built-in objects and their prototypes, of `process`, `Buffer`, `console` and the `fs` and
 * `path` modules (a cell that patches `Array.prototype` or `fs.readFileSync`); process.env; the working folder; the
 * umask and exitCode; process event listeners; CommonJS modules loaded by the run (they load afresh next time).
 * What makes a process unfit to hand on (the next run then gets a new one): a property that cannot be put back
 * (made non-configurable or frozen by a cell), and anything still active after the run's timers were cleared
 * (a server, a socket, a child process, a file operation in flight).
 */
import fs from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";

type Descriptors = Map<PropertyKey, PropertyDescriptor>;

/** What `takeBaseline` records. Opaque outside this module. */
export interface ProcessBaseline {
  readonly objects: readonly {
    readonly target: object;
    readonly name: string;
    readonly own: Descriptors;
    readonly extensible: boolean;
  }[];
  readonly env: Readonly<Record<string, string | undefined>>;
  readonly cwd: string;
  readonly umask: number;
  readonly listeners: ReadonlyMap<string | symbol, readonly ((...args: unknown[]) => void)[]>;
  readonly modules: ReadonlySet<string>;
  readonly resources: ReadonlyMap<string, number>;
}

/** How putting the baseline back went: `clean` when the process may serve another run. */
export interface RestoreOutcome {
  readonly clean: boolean;
  /** Why it is not clean, in words for a debug log (empty when clean). */
  readonly leftovers: readonly string[];
}

const requireHere = createRequire(import.meta.url);

/** The built-in objects whose own properties a cell might change, with names for the leftovers list. */
function watchedObjects(extra: Readonly<Record<string, object>>): [string, object][] {
  const g = globalThis as unknown as Record<string, unknown>;
  const named: [string, object][] = [["globalThis", globalThis]];
  const constructors = [
    "Object",
    "Function",
    "Array",
    "String",
    "Number",
    "Boolean",
    "Symbol",
    "BigInt",
    "Date",
    "RegExp",
    "Promise",
    "Map",
    "Set",
    "WeakMap",
    "WeakSet",
    "WeakRef",
    "Error",
    "TypeError",
    "RangeError",
    "SyntaxError",
    "ReferenceError",
    "EvalError",
    "URIError",
    "AggregateError",
    "ArrayBuffer",
    "SharedArrayBuffer",
    "DataView",
    "Int8Array",
    "Uint8Array",
    "Uint8ClampedArray",
    "Int16Array",
    "Uint16Array",
    "Int32Array",
    "Uint32Array",
    "Float32Array",
    "Float64Array",
    "BigInt64Array",
    "BigUint64Array",
    "Buffer",
    "URL",
    "TextEncoder",
    "TextDecoder",
  ];
  for (const name of constructors) {
    const c = g[name] as ({ prototype?: object } & object) | undefined;
    if (typeof c !== "function") continue;
    named.push([name, c]);
    const prototype = (c as { prototype?: object }).prototype;
    if (prototype) named.push([`${name}.prototype`, prototype]);
  }
  const typedArray = Object.getPrototypeOf(Int8Array) as { prototype: object };
  named.push(["TypedArray", typedArray], ["TypedArray.prototype", typedArray.prototype]);
  const iterator = Object.getPrototypeOf(Object.getPrototypeOf([][Symbol.iterator]())) as object;
  named.push(["Iterator.prototype", iterator]);
  for (const name of ["Math", "JSON", "Reflect", "Intl", "Atomics", "console", "process"]) {
    const o = g[name];
    if (typeof o === "object" && o !== null) named.push([name, o]);
  }
  named.push(["fs", fs], ["fs.promises", fs.promises], ["path", path]);
  for (const [name, o] of Object.entries(extra)) named.push([name, o]);
  return named;
}

/** `process` as a plain event emitter (its typed overloads take only known event names). */
const emitter = () => process as unknown as import("node:events").EventEmitter;

function ownDescriptors(target: object): Descriptors {
  const own: Descriptors = new Map();
  for (const key of Reflect.ownKeys(target)) {
    const d = Reflect.getOwnPropertyDescriptor(target, key);
    if (d) own.set(key, d);
  }
  return own;
}

function sameDescriptor(a: PropertyDescriptor, b: PropertyDescriptor): boolean {
  return (
    a.value === b.value &&
    a.get === b.get &&
    a.set === b.set &&
    a.writable === b.writable &&
    a.enumerable === b.enumerable &&
    a.configurable === b.configurable
  );
}

/** The kinds of active resources (timers, handles, requests) and how many of each. */
function activeResources(): Map<string, number> {
  const counts = new Map<string, number>();
  for (const r of process.getActiveResourcesInfo()) counts.set(r, (counts.get(r) ?? 0) + 1);
  return counts;
}

/** Records the state a run may change; `extra` names further objects to watch (e.g. the library's namespace). */
export function takeBaseline(extra: Readonly<Record<string, object>> = {}): ProcessBaseline {
  return {
    objects: watchedObjects(extra).map(([name, target]) => ({
      target,
      name,
      own: ownDescriptors(target),
      extensible: Object.isExtensible(target),
    })),
    env: { ...process.env },
    cwd: process.cwd(),
    umask: process.umask(),
    listeners: new Map(process.eventNames().map((e) => [e, emitter().listeners(e) as never])),
    modules: new Set(Object.keys(requireHere.cache)),
    resources: activeResources(),
  };
}

/** Puts the recorded state back; says whether the process is as clean as when the baseline was taken. */
export function restoreBaseline(baseline: ProcessBaseline): RestoreOutcome {
  const leftovers: string[] = [];
  for (const watched of baseline.objects) restoreObject(watched, leftovers);
  restoreEnv(baseline.env);
  try {
    if (process.cwd() !== baseline.cwd) process.chdir(baseline.cwd);
  } catch (e) {
    leftovers.push(`the working folder could not be set back: ${(e as Error).message}`);
  }
  process.umask(baseline.umask);
  process.exitCode = undefined;
  for (const event of process.eventNames()) {
    const kept = baseline.listeners.get(event) ?? [];
    for (const listener of emitter().listeners(event) as ((...args: unknown[]) => void)[])
      if (!kept.includes(listener)) emitter().removeListener(event, listener);
  }
  for (const id of Object.keys(requireHere.cache))
    if (!baseline.modules.has(id)) delete requireHere.cache[id];
  for (const [kind, count] of activeResources()) {
    const before = baseline.resources.get(kind) ?? 0;
    if (count > before) leftovers.push(`${count - before} × ${kind} still active`);
  }
  return { clean: leftovers.length === 0, leftovers };
}

function restoreObject(
  watched: { target: object; name: string; own: Descriptors; extensible: boolean },
  leftovers: string[],
): void {
  const { target, name, own } = watched;
  // Object.freeze, seal or preventExtensions by a cell cannot be undone.
  if (watched.extensible && !Object.isExtensible(target)) leftovers.push(`${name} was frozen or sealed`);
  for (const key of Reflect.ownKeys(target)) {
    if (own.has(key)) continue;
    if (!Reflect.deleteProperty(target, key)) leftovers.push(`${name}.${String(key)} cannot be removed`);
  }
  for (const [key, d] of own) {
    const now = Reflect.getOwnPropertyDescriptor(target, key);
    if (now && sameDescriptor(now, d)) continue;
    if (!Reflect.defineProperty(target, key, d)) leftovers.push(`${name}.${String(key)} cannot be put back`);
  }
}

function restoreEnv(env: Readonly<Record<string, string | undefined>>): void {
  for (const key of Object.keys(process.env)) if (!Object.hasOwn(env, key)) delete process.env[key];
  for (const [key, value] of Object.entries(env)) if (process.env[key] !== value) process.env[key] = value;
}
