import type { HTMLAttributes } from 'react';

/**
 * The page's one h1. It can take focus from script (never from Tab), so that after every navigation focus lands
 * here and a screen reader reads the new page's name (see useFocusOnNavigation).
 */
export function PageHeading({ className = 'text-2xl font-bold text-ink-900 sm:text-3xl', children, ...rest }: HTMLAttributes<HTMLHeadingElement>) {
  return (
    <h1 tabIndex={-1} data-page-heading="" className={`scroll-mt-4 ${className}`} {...rest}>
      {children}
    </h1>
  );
}
