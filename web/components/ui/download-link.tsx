import { buttonClasses } from './button';

interface DownloadLinkProps {
  /** The API address of the file, with the view's filters in its query string. */
  href: string;
  label?: string;
  size?: 'sm' | 'md';
}

/**
 * A file download as a plain link: the browser sends the session cookie with it and saves the answer under the
 * name the API gives (Content-Disposition), so nothing is held in the page.
 */
export function DownloadLink({ href, label = 'Download CSV', size = 'sm' }: DownloadLinkProps) {
  return (
    <a href={href} download className={buttonClasses('secondary', size)}>
      {label}
    </a>
  );
}
