// The product's parts in navigation order, with icons and who may open each.
import { mdiAccountGroup, mdiBarn, mdiCalendarRange, mdiCow, mdiFileChart, mdiFlask, mdiScaleBalance, mdiSprout, mdiTractor, mdiViewDay } from '@mdi/js'
import type { Permission } from '@shared/schemas/roles'

export type NavItem = { name: string; title: string; icon: string; permission: Permission; blurb: string }

export const navItems: NavItem[] = [
  { name: 'today', title: 'Today', icon: mdiTractor, permission: 'operation:read', blurb: "Each group's fence move, feeding and hazards for today, with a tap to record them." },
  { name: 'herds', title: 'Herds', icon: mdiCow, permission: 'operation:read', blurb: 'Herd groups with their stage, weights and winter conditions, and the daily needs computed for them.' },
  { name: 'fields', title: 'Fields', icon: mdiSprout, permission: 'operation:read', blurb: 'Fields, their corridor layout and what each component supplies through the winter.' },
  { name: 'feeds', title: 'Feeds', icon: mdiBarn, permission: 'operation:read', blurb: 'Book-value reference feeds and your purchased supplements and minerals with prices.' },
  { name: 'lab-results', title: 'Lab results', icon: mdiFlask, permission: 'operation:read', blurb: 'Feed analyses entered by form or CSV upload, with their edit history.' },
  { name: 'balance', title: 'Balance', icon: mdiScaleBalance, permission: 'operation:read', blurb: 'Need against supply for a herd group on its field, and the cheapest supplement that closes the gap.' },
  { name: 'strip-plan', title: 'Strip plan', icon: mdiViewDay, permission: 'operation:read', blurb: 'Daily or n-day strips: strip area, fence move and how long the field lasts.' },
  { name: 'season', title: 'Season', icon: mdiCalendarRange, permission: 'operation:read', blurb: 'Dry-matter supply against demand by week across every field and group, and the season’s supplement bill.' },
  { name: 'reports', title: 'Reports', icon: mdiFileChart, permission: 'operation:read', blurb: 'Printable and PDF reports of balances and plans, e-mailed to members or clients.' },
  { name: 'team', title: 'Team', icon: mdiAccountGroup, permission: 'operation:read', blurb: 'Members of this operation and their roles; owners invite and remove.' },
]
