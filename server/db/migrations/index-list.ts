import { Foundation1764633600000 } from './1764633600000-Foundation';

export const MIGRATIONS = [Foundation1764633600000];
