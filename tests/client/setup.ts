import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';
import { installHumanMessages } from '../../shared/schemas/human-messages';

// As in the app: schema checks without their own message speak in words, not the library's wording.
installHumanMessages();

// The component tests run as a user whose browser is set to British English; tests/client/format-time.test.ts tries others.
Object.defineProperty(window.navigator, 'languages', { value: ['en-GB'], configurable: true });

// Testing Library unmounts after each test only when the runner exposes globals; Vitest does not by default.
afterEach(() => cleanup());
