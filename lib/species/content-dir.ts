import fs from 'node:fs';
import path from 'node:path';
import { parseSpeciesMarkdown, SPECIES_CONTENT_DIR, type ParsedSpecies } from './content';

// File-system access lives apart from the parser so the app's routes (which only parse and
// serialize) do not make the bundler trace the whole project.

export interface SpeciesFile {
  file: string;
  result: ParsedSpecies;
}

/** Every `*.md` file of a folder (default: content/species under the working directory), sorted by name. */
export function readSpeciesDir(dir = path.resolve(process.cwd(), SPECIES_CONTENT_DIR)): SpeciesFile[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.md'))
    .sort()
    .map((file) => ({ file, result: parseSpeciesMarkdown(fs.readFileSync(path.join(dir, file), 'utf8')) }));
}
