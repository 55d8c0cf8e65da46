// "Show more" under a paged list (TanStack's infinite query): the next page on a tap, and the reason when it failed,
// with the rows already shown left in place.
import type { UseInfiniteQueryResult } from '@tanstack/react-query';
import { Button, type ButtonProps } from './button.tsx';
import { FormMessage } from './form-field.tsx';
import { errorMessage } from '../lib/form-errors.ts';

type PagedQuery = Pick<UseInfiniteQueryResult, 'hasNextPage' | 'fetchNextPage' | 'isFetchingNextPage' | 'isFetchNextPageError' | 'error'>;

export function ShowMore({
  query,
  label,
  className = 'mt-3',
  size = 'sm',
}: {
  query: PagedQuery;
  label: string;
  className?: string;
  size?: ButtonProps['size'];
}) {
  return (
    <>
      {query.hasNextPage && (
        <Button variant="secondary" size={size} className={className} onClick={() => query.fetchNextPage()} busy={query.isFetchingNextPage}>
          {label}
        </Button>
      )}
      {query.isFetchNextPageError && (
        <div className="mt-2">
          <FormMessage>{errorMessage(query.error)}</FormMessage>
        </div>
      )}
    </>
  );
}
