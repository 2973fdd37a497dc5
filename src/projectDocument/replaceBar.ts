// One bar of a project replaced: the step every bar edit shares (kept out of the public index).
import { InputError } from '../fileFormats/InputError.ts';
import type { ProjectBar, ProjectFile } from './projectFileTypes.ts';

/** The project with bar `barId` replaced by `change` of a copy of it; InputError when there is no such bar. */
export function replaceBar(project: ProjectFile, barId: string, change: (bar: ProjectBar) => ProjectBar): ProjectFile {
  const index = project.bars.findIndex((bar) => bar.id === barId);
  if (index < 0) throw new InputError('project', 'bar', `no bar with id "${barId}"`);
  const bars = project.bars.slice();
  bars[index] = change(structuredClone(project.bars[index]!));
  return { ...project, bars };
}
