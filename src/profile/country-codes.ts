// ISO 3166-1 country codes: the 249 officially assigned alpha-2 codes and their alpha-3 codes, in the same
// order (alpha-2 alphabetical). The list is written from memory of ISO 3166-1 (the standard's online
// browsing platform is the published source); user-assigned and exceptionally reserved codes (XK, UK, EU) are
// left out on purpose.

const ALPHA2 = `AD AE AF AG AI AL AM AO AQ AR AS AT AU AW AX AZ
BA BB BD BE BF BG BH BI BJ BL BM BN BO BQ BR BS BT BV BW BY BZ
CA CC CD CF CG CH CI CK CL CM CN CO CR CU CV CW CX CY CZ
DE DJ DK DM DO DZ EC EE EG EH ER ES ET FI FJ FK FM FO FR
GA GB GD GE GF GG GH GI GL GM GN GP GQ GR GS GT GU GW GY HK HM HN HR HT HU
ID IE IL IM IN IO IQ IR IS IT JE JM JO JP KE KG KH KI KM KN KP KR KW KY KZ
LA LB LC LI LK LR LS LT LU LV LY
MA MC MD ME MF MG MH MK ML MM MN MO MP MQ MR MS MT MU MV MW MX MY MZ
NA NC NE NF NG NI NL NO NP NR NU NZ OM PA PE PF PG PH PK PL PM PN PR PS PT PW PY QA
RE RO RS RU RW SA SB SC SD SE SG SH SI SJ SK SL SM SN SO SR SS ST SV SX SY SZ
TC TD TF TG TH TJ TK TL TM TN TO TR TT TV TW TZ UA UG UM US UY UZ
VA VC VE VG VI VN VU WF WS YE YT ZA ZM ZW`;

const ALPHA3 = `AND ARE AFG ATG AIA ALB ARM AGO ATA ARG ASM AUT AUS ABW ALA AZE
BIH BRB BGD BEL BFA BGR BHR BDI BEN BLM BMU BRN BOL BES BRA BHS BTN BVT BWA BLR BLZ
CAN CCK COD CAF COG CHE CIV COK CHL CMR CHN COL CRI CUB CPV CUW CXR CYP CZE
DEU DJI DNK DMA DOM DZA ECU EST EGY ESH ERI ESP ETH FIN FJI FLK FSM FRO FRA
GAB GBR GRD GEO GUF GGY GHA GIB GRL GMB GIN GLP GNQ GRC SGS GTM GUM GNB GUY HKG HMD HND HRV HTI HUN
IDN IRL ISR IMN IND IOT IRQ IRN ISL ITA JEY JAM JOR JPN KEN KGZ KHM KIR COM KNA PRK KOR KWT CYM KAZ
LAO LBN LCA LIE LKA LBR LSO LTU LUX LVA LBY
MAR MCO MDA MNE MAF MDG MHL MKD MLI MMR MNG MAC MNP MTQ MRT MSR MLT MUS MDV MWI MEX MYS MOZ
NAM NCL NER NFK NGA NIC NLD NOR NPL NRU NIU NZL OMN PAN PER PYF PNG PHL PAK POL SPM PCN PRI PSE PRT PLW PRY QAT
REU ROU SRB RUS RWA SAU SLB SYC SDN SWE SGP SHN SVN SJM SVK SLE SMR SEN SOM SUR SSD STP SLV SXM SYR SWZ
TCA TCD ATF TGO THA TJK TKL TLS TKM TUN TON TUR TTO TUV TWN TZA UKR UGA UMI USA URY UZB
VAT VCT VEN VGB VIR VNM VUT WLF WSM YEM MYT ZAF ZMB ZWE`;

/** Officially assigned ISO 3166-1 alpha-2 codes. */
export const ISO_ALPHA2: ReadonlySet<string> = new Set(ALPHA2.split(/\s+/));
/** Officially assigned ISO 3166-1 alpha-3 codes. */
export const ISO_ALPHA3: ReadonlySet<string> = new Set(ALPHA3.split(/\s+/));

/** The alpha-3 code of an alpha-2 code (same position in the two lists). */
export function alpha3Of(alpha2: string): string | undefined {
  const a2 = ALPHA2.split(/\s+/);
  const i = a2.indexOf(alpha2);
  return i < 0 ? undefined : ALPHA3.split(/\s+/)[i];
}

/** Which ISO 3166-1 code set a value belongs to, or null. */
export function countryCodeKind(value: string): 'alpha-2' | 'alpha-3' | null {
  const v = value.trim().toUpperCase();
  if (v.length === 2 && ISO_ALPHA2.has(v)) return 'alpha-2';
  if (v.length === 3 && ISO_ALPHA3.has(v)) return 'alpha-3';
  return null;
}
