/**
 * Props that keep a control off paper: on the web they become `data-print="hide"`, which the
 * print styles (`print-styles.web.ts`) hide. React Native Web turns `dataSet` into data-*
 * attributes; native platforms ignore it. Spread into a component: `<Pressable {...printHidden}>`.
 */
export const printHidden = { dataSet: { print: 'hide' } } as object;
