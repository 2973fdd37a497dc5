import type { Command } from './command.ts';
import { modesCommand } from './commands/modes.ts';
import { materialsCommand } from './commands/materials.ts';
import { designCommand } from './commands/design.ts';
import { characterizeCommand } from './commands/characterize.ts';
import { nextCutCommand } from './commands/next-cut.ts';
import { lotsCommand } from './commands/lots.ts';
import { tapCommand } from './commands/tap.ts';
import { tubesCommand } from './commands/tubes.ts';
import { planCommand } from './commands/plan.ts';
import { chimeCommand } from './commands/chime.ts';
import { bellbarCommand } from './commands/bellbar.ts';

/**
 * Every `barwright` sub-command, in the order `barwright help` lists them.
 * To add one: write `src/cli/commands/<name>.ts` exporting a `Command`, and add it here.
 */
export const commands: Command[] = [modesCommand, materialsCommand, designCommand, characterizeCommand, nextCutCommand, lotsCommand, tapCommand, tubesCommand, planCommand, chimeCommand, bellbarCommand];
