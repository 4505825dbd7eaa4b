import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';
import { installHumanMessages } from '../../shared/schemas/human-messages';

// As in the app: schema checks without their own message speak in words, not the library's wording.
installHumanMessages();

// Testing Library unmounts after each test only when the runner exposes globals; Vitest does not by default.
afterEach(() => cleanup());
