import { Outlet } from 'react-router-dom';
import { useFocusOnNavigation } from './use-focus-on-navigation';

/** Above every page, signed in or not: what happens on every change of page. */
export function RootLayout() {
  useFocusOnNavigation();
  return <Outlet />;
}
