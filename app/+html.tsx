import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';

import { colors } from '../src/theme';

// Static pages only: no inline scripts here, so the content security policy stays strict.
const globalCss = `
html, body { background-color: ${colors.background}; color: ${colors.text}; }
body { -webkit-font-smoothing: antialiased; font-variant-numeric: tabular-nums; }
a:focus-visible, [role="button"]:focus-visible, [role="link"]:focus-visible, [role="radio"]:focus-visible, [tabindex]:focus-visible {
  outline: 3px solid ${colors.focus} !important; outline-offset: 2px !important;
}
`;

export default function Root({ children }: PropsWithChildren) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, shrink-to-fit=no" />
        <meta name="theme-color" content={colors.text} />
        <meta name="description" content="Lagline sizes thermal insulation for line lists and tracks hot surfaces until they are safe." />
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: globalCss }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
