// `quern overlaps`: placeholder until its issue lands; replace the whole file.
import type { Command } from 'commander';
import { QuernError } from '../../src/index.js';
import type { CommandContext } from '../program.js';

export function registerOverlaps(program: Command, _ctx: CommandContext): void {
  program
    .command('overlaps')
    .description('(not built yet)')
    .allowUnknownOption(true)
    .action(() => {
      throw new QuernError('E_INTERNAL', 'quern overlaps is not built yet');
    });
}
