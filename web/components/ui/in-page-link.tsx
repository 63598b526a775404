import type { AnchorHTMLAttributes } from 'react';
import { focusById } from './focus';

/** A link to a part of the same page that takes focus there too, so Tab and a screen reader continue from it. */
export function InPageLink({ target, className = 'font-semibold text-brand-700 underline', children, ...rest }: { target: string } & AnchorHTMLAttributes<HTMLAnchorElement>) {
  return (
    <a href={`#${target}`} className={className} {...rest}
      onClick={(event) => {
        if (focusById(target)) event.preventDefault();
      }}>
      {children}
    </a>
  );
}
