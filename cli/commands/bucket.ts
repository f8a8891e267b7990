// `quern bucket`: placeholder until its issue lands; replace the whole file.
import type { Command } from 'commander';
import { QuernError } from '../../src/index.js';
import type { CommandContext } from '../program.js';

export function registerBucket(program: Command, _ctx: CommandContext): void {
  program
    .command('bucket')
    .description('(not built yet)')
    .allowUnknownOption(true)
    .action(() => {
      throw new QuernError('E_INTERNAL', 'quern bucket is not built yet');
    });
}
