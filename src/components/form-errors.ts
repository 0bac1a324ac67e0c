/** The first error react-hook-form holds, with its dotted field path (nested errors walked). */
import type { FieldErrors, FieldValues } from 'react-hook-form';

export function firstFormError<T extends FieldValues>(
  errors: FieldErrors<T>,
): { path: string; message: string } | null {
  const walk = (node: unknown, path: string[]): { path: string; message: string } | null => {
    if (!node || typeof node !== 'object') return null;
    const { message } = node as { message?: unknown };
    if (typeof message === 'string' && message) return { path: path.join('.'), message };
    for (const [key, child] of Object.entries(node)) {
      if (key === 'ref' || key === 'type' || key === 'types') continue;
      const found = walk(child, [...path, key]);
      if (found) return found;
    }
    return null;
  };
  return walk(errors, []);
}
