// Every command, in the order `quern --help` lists them.
import type { Command } from 'commander';
import type { CommandContext } from '../program.js';
import { registerProfile } from './profile.js';
import { registerGrain } from './grain.js';
import { registerRebin } from './rebin.js';
import { registerGaps } from './gaps.js';
import { registerOverlaps } from './overlaps.js';
import { registerBucket } from './bucket.js';
import { registerPeriod } from './period.js';
import { registerSql } from './sql.js';

export const commands: Array<(program: Command, ctx: CommandContext) => void> = [
  registerProfile,
  registerGrain,
  registerRebin,
  registerGaps,
  registerOverlaps,
  registerBucket,
  registerPeriod,
  registerSql,
];
