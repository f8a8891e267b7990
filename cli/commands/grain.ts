// `quern grain`: placeholder until its issue lands; replace the whole file.
import type { Command } from 'commander';
import { QuernError } from '../../src/index.js';
import type { CommandContext } from '../program.js';

export function registerGrain(program: Command, _ctx: CommandContext): void {
  program
    .command('grain')
    .description('(not built yet)')
    .allowUnknownOption(true)
    .action(() => {
      throw new QuernError('E_INTERNAL', 'quern grain is not built yet');
    });
}
