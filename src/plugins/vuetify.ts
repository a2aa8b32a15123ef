// Vuetify with StandGraze's own palette (sorghum rust, legume green, slate) and bundled SVG icons.
import 'vuetify/styles'
import { createVuetify } from 'vuetify'
import { aliases, mdi } from 'vuetify/iconsets/mdi-svg'

export const palette = {
  rust: '#a4481f', // sorghum rust: the grain and energy side
  legume: '#4f7d33', // legume green: protein, the corridor
  slate: '#3f4b57', // slate: chrome and text
  straw: '#d9b45a',
  paper: '#f7f4ee',
}

export function createAppVuetify() {
  return createVuetify({
    display: { mobileBreakpoint: 'md' },
    icons: { defaultSet: 'mdi', aliases, sets: { mdi } },
    theme: {
      defaultTheme: 'field',
      themes: {
        field: {
          dark: false,
          colors: {
            primary: palette.rust,
            secondary: palette.slate,
            accent: palette.legume,
            success: palette.legume,
            warning: '#b7791f',
            error: '#b3261e',
            info: '#35617d',
            background: palette.paper,
            surface: '#ffffff',
            'on-background': '#22292f',
            'surface-variant': '#e9e3d8',
          },
        },
      },
    },
    defaults: {
      VBtn: { style: 'text-transform: none; letter-spacing: 0;' },
      VTextField: { variant: 'outlined', density: 'comfortable' },
      VSelect: { variant: 'outlined', density: 'comfortable' },
      VCard: { rounded: 'lg' },
    },
  })
}
