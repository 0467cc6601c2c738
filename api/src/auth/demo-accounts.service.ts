import { Inject, Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import type { DemoAccounts } from '@provenote/shared';
import { Lab } from '../accounts/lab.entity';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { DEMO_ACCOUNTS, DEMO_LAB_NAME, DEMO_PASSWORD } from '../demo/demo-accounts';

const NONE: DemoAccounts = { accounts: [], password: null };

/** The demo sign-ins, only for a local installation (embedded mail) that holds the demo lab. */
@Injectable()
export class DemoAccountsService {
  constructor(
    @InjectRepository(Lab) private readonly labs: Repository<Lab>,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async list(): Promise<DemoAccounts> {
    if (this.config.MAIL_MODE !== 'embedded') return NONE;
    if (!(await this.labs.exists({ where: { name: DEMO_LAB_NAME } }))) return NONE;
    return { accounts: DEMO_ACCOUNTS, password: DEMO_PASSWORD };
  }
}
