// Creating a manuscript under an address that reveals nothing about other groups: the slug is the title's plus a random
// suffix, never "title-2", so a new address cannot tell that someone else's manuscript has the same title.
import { randomBytes } from 'node:crypto';
import { createManuscript } from '@/db/queries/manuscripts';
import type { Manuscript } from '@/db/schema';
import { isDomainError } from '@/lib/domain-error';
import { slugFromTitle } from '@/lib/validations/common';

/** Characters of the random suffix: 36⁶ ≈ 2·10⁹ addresses per title, so a retry is almost never needed. */
const SUFFIX_LENGTH = 6;

/**
 * A fresh address for a manuscript titled `title`.
 *
 * @example
 * manuscriptSlug('Flux tubes, part II'); // 'flux-tubes-part-ii-k3x9qa'
 */
export function manuscriptSlug(title: string): string {
  const alphabet = 'abcdefghijklmnopqrstuvwxyz0123456789';
  const suffix = [...randomBytes(SUFFIX_LENGTH)].map((byte) => alphabet[byte % alphabet.length]).join('');
  return `${slugFromTitle(title, 'manuscript')}-${suffix}`;
}

/**
 * Create a manuscript with `ownerId` as its first owner, under a fresh random address (retried on the rare clash).
 *
 * @throws DomainError `conflict` when no free address was found after a few tries
 */
export async function newManuscript({ ownerId, title, abstract }: { ownerId: string; title: string; abstract?: string }): Promise<Manuscript> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await createManuscript({ ownerId, title, abstract, slug: manuscriptSlug(title) });
    } catch (error) {
      if (!isDomainError(error, 'conflict') || attempt >= 4) throw error;
    }
  }
}
