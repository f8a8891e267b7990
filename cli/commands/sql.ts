// `quern sql`: placeholder until its issue lands; replace the whole file.
import type { Command } from 'commander';
import { QuernError } from '../../src/index.js';
import type { CommandContext } from '../program.js';

export function registerSql(program: Command, _ctx: CommandContext): void {
  program
    .command('sql')
    .description('(not built yet)')
    .allowUnknownOption(true)
    .action(() => {
      throw new QuernError('E_INTERNAL', 'quern sql is not built yet');
    });
}
