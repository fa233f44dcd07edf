import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';

// Lazy routes and debounced previews can take longer than the 1 s default on a busy CI machine.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  cleanup();
  window.localStorage.clear();
});
