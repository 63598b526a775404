import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { clearToasts } from '../../web/components/ui/toast-store';

// A lazily loaded route can take over a second to appear on a loaded 2-core machine; waiting up to 5 s keeps the
// find* queries about what appears, not about how busy the machine is.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});
