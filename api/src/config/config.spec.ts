import { ConfigurationError, loadConfig } from './config';

describe('loadConfig', () => {
  const valid = { DATABASE_URL: 'postgres://u@127.0.0.1:5432/db', REDIS_URL: 'redis://127.0.0.1:6379' };

  it('applies defaults and derives the public URL', () => {
    const config = loadConfig(valid);
    expect(config.PORT).toBe(8080);
    expect(config.PUBLIC_URL).toBe('http://127.0.0.1:8080');
    expect(config.WORKERS).toBe('embedded');
  });

  it('lists every missing or invalid setting at once', () => {
    let error: unknown;
    try {
      loadConfig({ REDIS_URL: 'http://nope', PORT: 'eighty' });
    } catch (caught) {
      error = caught;
    }
    expect(error).toBeInstanceOf(ConfigurationError);
    const problems = (error as ConfigurationError).problems;
    expect(problems).toContain('DATABASE_URL is missing');
    expect(problems.some((p) => p.startsWith('REDIS_URL'))).toBe(true);
    expect(problems.some((p) => p.startsWith('PORT'))).toBe(true);
  });

  it('requires SMTP_URL when mail goes to a real server', () => {
    expect(() => loadConfig({ ...valid, MAIL_MODE: 'smtp' })).toThrow(/SMTP_URL is missing/);
  });
});
