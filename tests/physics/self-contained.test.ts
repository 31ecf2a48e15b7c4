// The solver stands alone: every file under lib/physics imports only relative paths inside lib/physics, node:
// built-ins and npm packages; never the app ('@/'), a file elsewhere in the repository, or package.json.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const PHYSICS = path.join(ROOT, 'lib', 'physics');

/** Every .ts file below a folder. */
function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return entry.name.endsWith('.ts') ? [full] : [];
  });
}

/** Import specifiers of a source (static imports, re-exports, import(), require()), comments ignored. */
function specifiers(source: string): string[] {
  return ts.preProcessFile(source, true, true).importedFiles.map((f) => f.fileName);
}

/** Why a specifier in `file` breaks the rule, or null when it is allowed. */
function violation(file: string, specifier: string): string | null {
  if (/(^|\/)package\.json$/.test(specifier)) return 'reads package.json';
  if (specifier.startsWith('@/') || specifier.startsWith('~/')) return 'uses the app alias';
  if (specifier.startsWith('.') || specifier.startsWith('/')) {
    const target = path.resolve(path.dirname(file), specifier);
    const inside = path.relative(PHYSICS, target);
    return inside.startsWith('..') || path.isAbsolute(inside) ? 'leaves lib/physics' : null;
  }
  if (specifier.startsWith('node:')) return null;
  // A bare name: an npm package the project depends on.
  const pkg = JSON.parse(readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as { dependencies?: Record<string, string> };
  const name = specifier.startsWith('@') ? specifier.split('/').slice(0, 2).join('/') : specifier.split('/')[0];
  return pkg.dependencies && name in pkg.dependencies ? null : `is not a runtime dependency (bare built-ins need the node: prefix)`;
}

function violations(file: string, source: string): string[] {
  return specifiers(source).flatMap((s) => {
    const why = violation(file, s);
    return why ? [`${path.relative(ROOT, file)}: '${s}' ${why}`] : [];
  });
}

describe('lib/physics imports nothing outside itself', () => {
  it('finds the import specifiers of every file under lib/physics', () => {
    const files = sourceFiles(PHYSICS);
    expect(files.length).toBeGreaterThan(40);
    const all = files.flatMap((f) => specifiers(readFileSync(f, 'utf8')));
    expect(all).toContain('zod');
    expect(all).toContain('./types');
  });

  it('holds for every file', () => {
    const found = sourceFiles(PHYSICS).flatMap((f) => violations(f, readFileSync(f, 'utf8')));
    expect(found).toEqual([]);
  });

  it('catches each kind of breach (the check can fail)', () => {
    const file = path.join(PHYSICS, 'eigen', 'example.ts');
    const source = [
      "// import from '@/lib/ignored-comment'",
      "import pkg from '../../package.json';",
      "import { db } from '@/db';",
      "import { x } from '../../runs/input-hash';",
      "export { y } from '../../../scripts/compute';",
      "const fs = require('fs');",
      "const m = await import('left-pad');",
      "import { z } from 'zod';",
      "import { ok } from '../csr';",
      "import { readFileSync } from 'node:fs';",
    ].join('\n');
    expect(violations(file, source)).toEqual([
      "lib/physics/eigen/example.ts: '../../package.json' reads package.json",
      "lib/physics/eigen/example.ts: '@/db' uses the app alias",
      "lib/physics/eigen/example.ts: '../../runs/input-hash' leaves lib/physics",
      "lib/physics/eigen/example.ts: '../../../scripts/compute' leaves lib/physics",
      "lib/physics/eigen/example.ts: 'fs' is not a runtime dependency (bare built-ins need the node: prefix)",
      "lib/physics/eigen/example.ts: 'left-pad' is not a runtime dependency (bare built-ins need the node: prefix)",
    ]);
  });
});
