// Every command, in the order `quern --help` lists them, loaded only when needed: a run of one command
// loads that command's code alone, which keeps start-up short.
import type { Command } from 'commander';
import type { CommandContext } from '../program.js';

export type RegisterCommand = (program: Command, ctx: CommandContext) => void;

export const commandLoaders: ReadonlyArray<readonly [name: string, load: () => Promise<RegisterCommand>]> = [
  ['profile', async () => (await import('./profile.js')).registerProfile],
  ['grain', async () => (await import('./grain.js')).registerGrain],
  ['rebin', async () => (await import('./rebin.js')).registerRebin],
  ['gaps', async () => (await import('./gaps.js')).registerGaps],
  ['overlaps', async () => (await import('./overlaps.js')).registerOverlaps],
  ['bucket', async () => (await import('./bucket.js')).registerBucket],
  ['period', async () => (await import('./period.js')).registerPeriod],
  ['sql', async () => (await import('./sql.js')).registerSql],
];

/** The commands to load for `argv`: the one it names, or all of them (help, version, a misspelt name). */
export async function loadCommands(argv: readonly string[]): Promise<RegisterCommand[]> {
  const first = argv.find((a) => !a.startsWith('-'));
  const named = commandLoaders.find(([name]) => name === first);
  const wanted = named !== undefined && first === argv[0] ? [named] : commandLoaders;
  return Promise.all(wanted.map(([, load]) => load()));
}
