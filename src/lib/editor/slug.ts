// Slugs for new procedures: readable, made from the title, and within the schema's key rule.

const MAX_KEY = 64;

/** 'Wren 160: install the sump (copy)' → 'wren-160-install-the-sump-copy'; '' when nothing usable is left. */
export function slugify(text: string, maxLength = MAX_KEY): string {
  const base = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return base.slice(0, maxLength).replace(/-+$/, '');
}

/** The first of base, base-2, base-3 … that `isTaken` refuses, kept within the key length. */
export function uniqueSlug(base: string, isTaken: (slug: string) => boolean): string {
  const root = base || 'procedure';
  if (!isTaken(root)) return root;
  for (let n = 2; ; n++) {
    const suffix = `-${n}`;
    const candidate = `${root.slice(0, MAX_KEY - suffix.length).replace(/-+$/, '')}${suffix}`;
    if (!isTaken(candidate)) return candidate;
  }
}
