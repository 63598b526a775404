import { Foundation1764633600000 } from './1764633600000-Foundation';
import { Enrolment1764720000000 } from './1764720000000-Enrolment';

export const MIGRATIONS = [Foundation1764633600000, Enrolment1764720000000];
