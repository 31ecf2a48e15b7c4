// The database layer knows nothing of HTTP, authorisation or validation: no file under db/ imports from lib/http,
// lib/authz or lib/validations (the rules live in lib/, the status codes at the edge), checked on every import form.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const FORBIDDEN = ['lib/http', 'lib/authz', 'lib/validations'];

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return entry.name === 'migrations' ? [] : sourceFiles(full);
    return entry.name.endsWith('.ts') ? [full] : [];
  });
}

/** The repository-relative module a specifier of `file` points at ('@/x' and relative paths), or null for packages. */
function target(file: string, specifier: string): string | null {
  if (specifier.startsWith('@/')) return specifier.slice(2);
  if (specifier.startsWith('.')) return path.relative(ROOT, path.resolve(path.dirname(file), specifier));
  return null;
}

function violations(file: string, source: string): string[] {
  return ts.preProcessFile(source, true, true).importedFiles.flatMap(({ fileName }) => {
    const module = target(file, fileName);
    const hit = module && FORBIDDEN.find((folder) => module === folder || module.startsWith(`${folder}/`));
    return hit ? [`${path.relative(ROOT, file)} imports '${fileName}' (${hit})`] : [];
  });
}

describe('db/ stays below lib/', () => {
  it('reads the imports of every file under db/ (a breach would be found)', () => {
    const files = sourceFiles(path.join(ROOT, 'db'));
    expect(files.length).toBeGreaterThan(10);
    const probe = path.join(ROOT, 'db', 'queries', 'probe.ts');
    expect(violations(probe, "import { route } from '@/lib/http/handler';\nexport * from '../../lib/authz/roles';")).toHaveLength(2);
    expect(violations(probe, "import { db } from '@/db';\nimport { DomainError } from '@/lib/domain-error';")).toEqual([]);
  });

  it('holds for every file under db/', () => {
    const found = sourceFiles(path.join(ROOT, 'db')).flatMap((f) => violations(f, readFileSync(f, 'utf8')));
    expect(found).toEqual([]);
  });
});
