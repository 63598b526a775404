import { Fragment } from 'react';

/**
 * An e-mail address that may wrap only where a reader expects it, before the "@" and before each dot of the domain,
 * never in the middle of a name. A part longer than the whole line still wraps rather than overflowing.
 */
export function EmailText({ address, className = '' }: { address: string; className?: string }) {
  const at = address.lastIndexOf('@');
  const local = at === -1 ? address : address.slice(0, at);
  const domain = at === -1 ? '' : address.slice(at + 1);
  return (
    <span className={`break-words ${className}`}>
      {local}
      {at !== -1 && (
        <>
          <wbr />@
          {domain.split('.').map((part, index) => (
            <Fragment key={index}>
              {index > 0 && <><wbr />.</>}
              {part}
            </Fragment>
          ))}
        </>
      )}
    </span>
  );
}
