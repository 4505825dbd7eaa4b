import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';

// Testing Library unmounts after each test only when the runner exposes globals; Vitest does not by default.
afterEach(() => cleanup());
