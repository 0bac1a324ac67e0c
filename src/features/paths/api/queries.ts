/** The Paths feature's query keys and options: the size of this device's result cache. */
import { queryOptions } from '@tanstack/react-query';
import { appDb } from '../../../store/db';
import { cacheSize } from '../../../store/result-cache';

export const pathsKeys = { cacheSize: ['local', 'cache-size'] as const };

export const cacheSizeQuery = queryOptions({
  queryKey: pathsKeys.cacheSize,
  queryFn: () => cacheSize(appDb()),
});
