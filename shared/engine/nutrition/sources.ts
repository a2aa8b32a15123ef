// Names of the published works the nutrition engine draws on, cited in results and warnings.

/** Short citations, one per published work; kept in one place so every result names the same edition. */
export const SOURCES = {
  nrcBeef2000: 'NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed. (1996), Update 2000',
  nrcBeef2000p126: 'NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed., Update 2000, p. 126 (TDN, DE and ME)',
  nrcBeef2000Table42: 'NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed., Update 2000, p. 43 and Table 4-2 (pregnancy)',
  nrcBeef2000p45: 'NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed., Update 2000, p. 45 (milk yield curve, Jenkins & Ferrell 1984)',
  nrcBeef2000p8: 'NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed., Update 2000, p. 8 (bulls +15 %)',
  nrcBeef1996Memory: 'NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed. (1996) — coefficient from memory, not verified',
  zinn2008: 'Zinn, Barreras, Owens & Plascencia, J. Anim. Sci. 86:2680 (2008) — NEm 0.077 Mcal/kg^0.75 (Lofgreen & Garrett 1968)',
  hersomAn190: 'Hersom, Basic Nutrient Requirements of Beef Cows, UF/IFAS EDIS AN190 (2007, rev. 2017) — lactation +20 %',
  diMarco2001: 'Di Marco & Aello, Arq. Bras. Med. Vet. Zootec. 53(1) (2001) — grazing raises maintenance ×1.08–1.30',
  coatLct: 'Lower critical temperature by coat condition: "Are your cows prepared for the winter cold?" (extension article); NDSU Extension "Lower Critical Temperature for Beef Cattle"',
  onePctPerF: 'NDSU Extension "Lower Critical Temperature for Beef Cattle" and K-State (AgProud) — energy need +1 % per °F below the lower critical temperature',
  windChillRule: 'Meteer, OSU Extension (via Farms.com) — rough wind chill: °F minus wind speed in mph (rule of thumb)',
  az9523: 'Sprinkle, Matching Forage Resources with Cow Herd Supplementation, Arizona Coop. Ext. AZ9523 (rev. 2011)',
  nrcSheep1985Table1: 'NRC, Nutrient Requirements of Sheep, 6th rev. ed. (1985), Table 1 (p. 45)',
  nrcSheep1985Memory: 'NRC, Nutrient Requirements of Sheep, 6th rev. ed. (1985), Table 1 — row from memory, not verified',
  montanaPearson: 'Montana State Univ. Extension, "Pearson Square Examples"',
  clemsonNitrate: 'Clemson University Agricultural Service Laboratory, nitrate (NO3-N) guide',
  kstateNitrate: 'K-State Research and Extension, nitrate (NO3) guide',
  duncan1997: 'Duncan, In Practice 19:503 (1997) — maximum safe dietary Cu for sheep ≈ 15 mg/kg',
  berger: 'Berger, Univ. of Illinois (citing Church & Pond 1988) — sheep Cu toxicity from ≈ 10 mg/kg DM; cattle mineral salts 300–400 mg/kg Cu',
  mercknasem2016: 'NASEM, Nutrient Requirements of Beef Cattle, 8th rev. ed. (2016), via Merck Veterinary Manual mineral table — Cu max tolerable 40 mg/kg',
  kentuckyUrea: 'Univ. of Kentucky — at most 1/3 of dietary N from urea; ruminants only',
  unlUrea: 'Univ. of Nebraska–Lincoln Beef FAQ "Urea toxicity" (2010) — CP = N × 6.25; 45 % N urea = 281 % CP',
  ureaShareCommon: 'Urea at most ≈ 1 % of diet DM (common practice)',
  grainCommon: 'Grain overload: cap grain intake and adapt stock gradually (common practice); K-State scouting rule of 8–10 bu/acre on the ground',
  caPCommon: 'Dietary Ca:P at least 1:1, preferably 1.5–2:1 (common practice)',
  forageTesting: 'Forage-testing shortcuts DDM = 88.9 − 0.779 × ADF; DMI %BW = 120 / NDF; RFV = DDM × DMI / 1.29 (common practice, from memory)',
  nist811: 'NIST SP 811 (2008), Appendix B',
  csu1615: 'Stanton & LeValley, Colorado State Univ. Fact Sheet 1.615 — table values vary ±10 % energy, ±15 % organic constituents, ±30 % minerals',
} as const

/** The usual caution that goes with every warning where harm is possible. */
export const CAUTION = 'A veterinarian, a licensed nutritionist and local regulations come first.'
