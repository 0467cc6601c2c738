import { createTheme, type MantineColorsTuple } from '@mantine/core';

/** Provenote's own blue-green, lightest to darkest. */
const tarn: MantineColorsTuple = [
  '#e8f4f6',
  '#d3e6ea',
  '#a7cdd5',
  '#77b2bf',
  '#519cac',
  '#3a8ea0',
  '#2c7f92',
  '#1f6b7c',
  '#165e6e',
  '#0a4f5e',
];

/** A warm ochre for highlights and warnings that are not errors. */
const ochre: MantineColorsTuple = [
  '#fdf6e4',
  '#f8eacb',
  '#f1d496',
  '#eabd5d',
  '#e4aa32',
  '#e09e17',
  '#de9806',
  '#c58300',
  '#af7400',
  '#986300',
];

export const theme = createTheme({
  primaryColor: 'tarn',
  primaryShade: { light: 7, dark: 4 },
  colors: { tarn, ochre },
  fontFamily: '"Nunito Sans", system-ui, sans-serif',
  headings: { fontFamily: '"Nunito Sans", system-ui, sans-serif', fontWeight: '800' },
  defaultRadius: 'md',
  cursorType: 'pointer',
  components: {
    Button: { defaultProps: { fw: 700 } },
  },
});
