/** Lengths of a run's name and note: checked on the server, shown by the form. */
export const NAME_MAX = 120;
export const NOTE_MAX = 4000;
