/** The public lab of worked examples (seeds/examples.ts makes it): its slug and name, in one place. */
export const EXAMPLE_LAB = { slug: "worked-examples", name: "Worked examples" } as const;
