import { BadRequestException, Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { EntityManager, Repository } from 'typeorm';
import { MailToken, type MailTokenPurpose } from './mail-token.entity';
import { hashSecret, newSecret } from './tokens';

export const LINK_NOT_VALID = 'This link has expired or was already used; ask for a new one';

@Injectable()
export class MailTokenService {
  constructor(@InjectRepository(MailToken) private readonly tokens: Repository<MailToken>) {}

  /** Stores a new one-time token and returns its secret for the link; earlier unused ones stop working. */
  async issue(purpose: MailTokenPurpose, email: string, ttlMs: number, payload: Record<string, string> = {}) {
    await this.tokens
      .createQueryBuilder()
      .update()
      .set({ usedAt: () => 'now()' })
      .where('purpose = :purpose AND email = :email AND used_at IS NULL', { purpose, email })
      .execute();
    const secret = newSecret();
    await this.tokens.insert({
      purpose,
      email,
      payload,
      tokenHash: hashSecret(secret),
      expiresAt: new Date(Date.now() + ttlMs),
    });
    return secret;
  }

  /**
   * Marks the token used and returns it, in one statement, so two requests with the same link cannot
   * both succeed. Expired, used, unknown and wrong-purpose tokens get the same answer.
   */
  async consume(purpose: MailTokenPurpose, secret: string, manager: EntityManager): Promise<MailToken> {
    const result = await manager
      .createQueryBuilder()
      .update(MailToken)
      .set({ usedAt: () => 'now()' })
      .where('token_hash = :hash AND purpose = :purpose AND used_at IS NULL AND expires_at > now()', {
        hash: hashSecret(secret),
        purpose,
      })
      .returning(['id', 'email', 'payload'])
      .execute();
    const row = (result.raw as Pick<MailToken, 'id' | 'email' | 'payload'>[])[0];
    if (!row) throw new BadRequestException(LINK_NOT_VALID);
    return row as MailToken;
  }
}
