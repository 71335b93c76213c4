import { benchSearch } from './search';
import { printTable } from './lib';
benchSearch().then(() => printTable());
