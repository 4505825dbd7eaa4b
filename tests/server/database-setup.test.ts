import { describe, expect, it } from 'vitest';
import { supportedServer } from '../../server/database-setup';

describe('the database server Benchwire accepts', () => {
  it('is MariaDB 10.6 or newer, the first release with SELECT … FOR UPDATE SKIP LOCKED', () => {
    // Version strings as `SELECT VERSION()` reports them; 10.6.0 added SKIP LOCKED (MariaDB 10.6 release notes),
    // 10.11.x is the Debian 12 package (packages.debian.org, bookworm: mariadb 1:10.11).
    expect(supportedServer('10.11.19-MariaDB-0+deb12u1')).toBe(true);
    expect(supportedServer('10.6.0-MariaDB')).toBe(true);
    expect(supportedServer('11.4.2-MariaDB-log')).toBe(true);
    expect(supportedServer('10.5.23-MariaDB')).toBe(false);
    expect(supportedServer('10.3.39-MariaDB-0+deb10u1')).toBe(false);
    // Another server family is refused by name, whatever its number.
    expect(supportedServer('8.0.36')).toBe(false);
  });
});
