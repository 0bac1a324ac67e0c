/**
 * A react-hook-form resolver for a zod schema that depends on the page's current inputs (the
 * chosen scenario's spot, market, model): the form checks against the schema of the moment,
 * whichever render it was created in.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useRef } from 'react';
import type { FieldValues, Resolver } from 'react-hook-form';
import type { z } from 'zod';

export function useSchemaResolver<In extends FieldValues, Out>(
  schema: () => z.ZodType<Out, In>,
): Resolver<In, unknown, Out> {
  const latest = useRef(schema);
  latest.current = schema;
  return (values, context, options) => zodResolver(latest.current())(values, context, options);
}
