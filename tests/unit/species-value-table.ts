import { TRADE, type ValueRow } from '../support/species-value-check';

// Every published value shipped in content/species/*.md, with the source it was read in, plus the
// trade flush habit of every species. The citation column is the source of each published row;
// flush-habit rows are trade rules (common practice, no published source).
export const speciesValueTable: ValueRow[] = [
  // Abies alba
  ['abies-alba', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Abies balsamea
  ['abies-balsamea', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Abies koreana
  ['abies-koreana', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Abies lasiocarpa
  ['abies-lasiocarpa', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Cedrus atlantica
  ['cedrus-atlantica', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Cedrus deodara
  ['cedrus-deodara', 'needleLengthMm', { min: 25, max: 50 }, 'Flora of China vol. 4 (1999): leaves 2.5–5 cm, in apparent fascicles of 15–20 on short shoots'],
  ['cedrus-deodara', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Cedrus libani
  ['cedrus-libani', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Chamaecyparis obtusa
  ['chamaecyparis-obtusa', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Chamaecyparis pisifera
  ['chamaecyparis-pisifera', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Cryptomeria japonica
  ['cryptomeria-japonica', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Juniperus chinensis
  ['juniperus-chinensis', 'needlesPerFascicle', null, 'Flora of China vol. 4 (1999)'],
  ['juniperus-chinensis', 'needleLengthMm', { min: 8, max: 12 }, 'Flora of China vol. 4 (1999) p. 74 (var. chinensis): needle-like leaves 0.8–1.2 cm'],
  ['juniperus-chinensis', 'hardinessZones', { min: 4, max: 9 }, 'University of Illinois Extension: zones 4–9'],
  ['juniperus-chinensis', 'nativeRange', 'Much of China, and Japan, Korea and Myanmar.', 'Flora of China vol. 4 (1999)'],
  ['juniperus-chinensis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Juniperus communis
  ['juniperus-communis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Juniperus osteosperma
  ['juniperus-osteosperma', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Juniperus procumbens
  ['juniperus-procumbens', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Juniperus rigida
  ['juniperus-rigida', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Juniperus scopulorum
  ['juniperus-scopulorum', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Juniperus virginiana
  ['juniperus-virginiana', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Larix decidua
  ['larix-decidua', 'needleLengthMm', { min: 25, max: 35 }, 'Kwantlen Polytechnic University plant database'],
  [
    'larix-decidua',
    'nativeRange',
    'Mountains of central Europe, mainly the Alps and Carpathians.',
    'Kwantlen Polytechnic University plant database (Europe); the detail from memory',
  ],
  ['larix-decidua', 'flushHabit', 'single', TRADE], // common practice, no published source
  ['larix-decidua', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Larix kaempferi
  ['larix-kaempferi', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Larix laricina
  ['larix-laricina', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Metasequoia glyptostroboides
  ['metasequoia-glyptostroboides', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Picea abies
  ['picea-abies', 'needlesPerFascicle', null, 'Flora of North America vol. 2 (1993)'],
  ['picea-abies', 'needleLengthMm', { min: 10, max: 25 }, 'Flora of North America vol. 2 (1993)'],
  ['picea-abies', 'vigour', 'high', 'University of Minnesota trees site: faster-growing than several other spruces'],
  ['picea-abies', 'hardinessZones', { min: 2, max: 7 }, 'University of Minnesota trees site: zones 2–7'],
  ['picea-abies', 'nativeRange', 'Northern and central Europe.', 'University of Minnesota trees site'],
  ['picea-abies', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Picea glauca
  ['picea-glauca', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Picea jezoensis
  ['picea-jezoensis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Picea mariana
  ['picea-mariana', 'needleLengthMm', { min: 6, max: 15 }, 'Flora of North America vol. 2 (1993): leaves 0.6–1.5(–2) cm'],
  ['picea-mariana', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Picea pungens
  ['picea-pungens', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus aristata
  ['pinus-aristata', 'needlesPerFascicle', 5, 'Scion / NZ Forest Research Institute key to cultivated pines'],
  ['pinus-aristata', 'needleLengthMm', { min: 20, max: 40 }, 'Scion / NZ Forest Research Institute key to cultivated pines: 20–40 mm, persisting 10–17 years'],
  ['pinus-aristata', 'vigour', 'low', 'Southern Utah University tree tour: very slow'],
  [
    'pinus-aristata',
    'nativeRange',
    'Colorado, northern New Mexico and the San Francisco Peaks of Arizona.',
    'Royal Botanic Gardens Victoria, Horticultural Flora of South-eastern Australia',
  ],
  ['pinus-aristata', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus balfouriana
  ['pinus-balfouriana', 'needlesPerFascicle', 5, 'Flora of North America vol. 2 (1993)'],
  ['pinus-balfouriana', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus banksiana
  ['pinus-banksiana', 'needlesPerFascicle', 2, 'Flora of North America vol. 2 (1993)'],
  ['pinus-banksiana', 'needleLengthMm', { min: 20, max: 50 }, 'Flora of North America vol. 2 (1993): 2–5 cm'],
  ['pinus-banksiana', 'hardinessZones', { min: 2, max: 6 }, 'Missouri Botanical Garden Plant Finder: USDA zones 2–6'],
  [
    'pinus-banksiana',
    'nativeRange',
    'Across Canada from Alberta and the Northwest Territories to Nova Scotia, and the north-central and north-eastern United States.',
    'Flora of North America vol. 2 (1993)',
  ],
  ['pinus-banksiana', 'flushHabit', 'polycyclic', TRADE], // common practice, no published source
  // Pinus cembra
  ['pinus-cembra', 'needlesPerFascicle', 5, 'Oregon State University Landscape Plants'],
  ['pinus-cembra', 'needleLengthMm', { min: 50, max: 80 }, 'Oregon State University Landscape Plants: 5–8 cm, persisting 4–5 years'],
  ['pinus-cembra', 'vigour', 'low', 'Morton Arboretum tree pages: slow-growing'],
  ['pinus-cembra', 'hardinessZones', { min: 3, max: 7 }, 'Morton Arboretum tree pages: zones 3–7'],
  [
    'pinus-cembra',
    'nativeRange',
    'Mountains of central Europe, mainly the Alps, with outlying stands in the Carpathians.',
    'University of Minnesota trees site',
  ],
  ['pinus-cembra', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus contorta
  ['pinus-contorta', 'shootHabit', 'multinodal', 'Shaw 1914, The Genus Pinus: spring-shoots multinodal'],
  ['pinus-contorta', 'needlesPerFascicle', 2, 'Flora of North America vol. 2 (1993)'],
  ['pinus-contorta', 'needleLengthMm', { min: 20, max: 70 }, 'Flora of North America vol. 2 (1993), var. contorta: 2–7 cm'],
  [
    'pinus-contorta',
    'nativeRange',
    'Western North America, from about 64°N in Yukon to northern Baja California, east to the Black Hills.',
    'Silvics of North America vol. 1 (Burns & Honkala 1990)',
  ],
  ['pinus-contorta', 'flushHabit', 'polycyclic', TRADE], // common practice, no published source
  ['pinus-contorta', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Pinus densiflora
  ['pinus-densiflora', 'needlesPerFascicle', 2, 'Flora of China vol. 4 (1999)'],
  ['pinus-densiflora', 'needleLengthMm', { min: 50, max: 150 }, 'Flora of China vol. 4 (1999): needles 5–15 cm'],
  [
    'pinus-densiflora',
    'nativeRange',
    'Japan, Korea, north-eastern China (Shandong, Jiangsu) and the far south-east of Russia.',
    'American Conifer Society species page',
  ],
  ['pinus-densiflora', 'flushHabit', 'double', TRADE], // common practice, no published source
  // Pinus flexilis
  ['pinus-flexilis', 'needlesPerFascicle', 5, 'Flora of North America vol. 2 (1993)'],
  ['pinus-flexilis', 'needleLengthMm', { min: 30, max: 70 }, 'Flora of North America vol. 2 (1993): leaves 5 per fascicle, 3–7 cm'],
  ['pinus-flexilis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus halepensis
  [
    'pinus-halepensis',
    'shootHabit',
    'multinodal',
    'Annals of Forest Science 2017, "Growth phenology in Pinus halepensis Mill." (doi:10.1007/s13595-017-0637-y)',
  ],
  ['pinus-halepensis', 'needlesPerFascicle', 2, 'Flora of New Zealand vol. 4 (Webb et al. 1988)'],
  ['pinus-halepensis', 'needleLengthMm', { min: 40, max: 120 }, 'Flora of New Zealand vol. 4 (Webb et al. 1988): (20–)40–120(–170) mm'],
  [
    'pinus-halepensis',
    'nativeRange',
    'The Mediterranean region, from Morocco and Spain to Libya, Greece and Israel.',
    'Oregon State University Landscape Plants',
  ],
  ['pinus-halepensis', 'flushHabit', 'polycyclic', TRADE], // common practice, no published source
  [
    'pinus-halepensis',
    'wildingCaution',
    true,
    '“Conifers as invasive aliens: a global survey and predictive framework”, Diversity and Distributions 10: 321–331 (2004)',
  ],
  // Pinus heldreichii
  ['pinus-heldreichii', 'needlesPerFascicle', 2, 'Flora Europaea vol. 1 (Tutin et al. 1964)'],
  ['pinus-heldreichii', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus koraiensis
  ['pinus-koraiensis', 'needlesPerFascicle', 5, 'Flora of China vol. 4 (1999)'],
  ['pinus-koraiensis', 'needleLengthMm', { min: 60, max: 120 }, 'Flora of China vol. 4 (1999): needles 5 per bundle, 6–12 cm'],
  ['pinus-koraiensis', 'nativeRange', 'Mountains of Heilongjiang and Jilin in China, and Japan, Korea and eastern Russia.', 'Flora of China vol. 4 (1999)'],
  ['pinus-koraiensis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus longaeva
  ['pinus-longaeva', 'needlesPerFascicle', 5, 'Flora of North America vol. 2 (1993)'],
  ['pinus-longaeva', 'needleLengthMm', { min: 15, max: 35 }, 'Flora of North America vol. 2 (1993): 15–35 mm, persisting 10–30 years'],
  ['pinus-longaeva', 'nativeRange', 'Subalpine and alpine slopes, 1700–3400 m, in California, Nevada and Utah.', 'Flora of North America vol. 2 (1993)'],
  ['pinus-longaeva', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus monticola
  ['pinus-monticola', 'needlesPerFascicle', 5, 'Flora of North America vol. 2 (1993)'],
  ['pinus-monticola', 'needleLengthMm', { min: 40, max: 100 }, 'Flora of North America vol. 2 (1993): leaves 5 per fascicle, 4–10 cm'],
  ['pinus-monticola', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus mugo
  ['pinus-mugo', 'shootHabit', 'uninodal', 'Shaw 1914, The Genus Pinus (as P. montana): spring-shoots uninodal'],
  ['pinus-mugo', 'needlesPerFascicle', 2, 'Shaw 1914, The Genus Pinus'],
  ['pinus-mugo', 'needleLengthMm', { min: 30, max: 80 }, 'Shaw 1914, The Genus Pinus: leaves 3–8 cm'],
  ['pinus-mugo', 'vigour', 'moderate', 'Utah State University Extension Tree Browser: growth rate medium'],
  ['pinus-mugo', 'hardinessZones', { min: 2, max: 8 }, 'Utah State University Extension Tree Browser: USDA zones 2–8'],
  [
    'pinus-mugo',
    'nativeRange',
    'Mountains of central and southern Europe, from the Pyrenees and Alps to the Carpathians and the northern Balkans.',
    'Shaw 1914, The Genus Pinus; Kew World Checklist of Selected Plant Families',
  ],
  ['pinus-mugo', 'flushHabit', 'single', TRADE], // common practice, no published source
  ['pinus-mugo', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Pinus nigra
  ['pinus-nigra', 'shootHabit', 'uninodal', 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5): spring-shoots uninodal'],
  ['pinus-nigra', 'needlesPerFascicle', 2, 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5)'],
  ['pinus-nigra', 'needleLengthMm', { min: 90, max: 160 }, 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5): leaves 9–16 cm'],
  ['pinus-nigra', 'vigour', 'moderate', 'Utah State University Extension Tree Browser: growth rate medium'],
  ['pinus-nigra', 'hardinessZones', { min: 4, max: 7 }, 'Utah State University Extension Tree Browser: USDA zones 4–7'],
  ['pinus-nigra', 'nativeRange', 'Mountains of central and southern Europe and Asia Minor.', 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5)'],
  ['pinus-nigra', 'flushHabit', 'single', TRADE], // common practice, no published source
  ['pinus-nigra', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Pinus parviflora
  ['pinus-parviflora', 'needlesPerFascicle', 5, 'Flora of China vol. 4 (1999)'],
  ['pinus-parviflora', 'needleLengthMm', { min: 35, max: 55 }, 'Flora of China vol. 4 (1999): needles 3.5–5.5 cm'],
  ['pinus-parviflora', 'vigour', 'low', 'Utah State University Extension Tree Browser: growth rate low'],
  ['pinus-parviflora', 'hardinessZones', { min: 4, max: 7 }, 'Utah State University Extension Tree Browser: USDA zones 4–7'],
  ['pinus-parviflora', 'nativeRange', 'Japan (mountains) and nearby islands.', 'Utah State University Extension Tree Browser: Japan'],
  ['pinus-parviflora', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus pinaster
  ['pinus-pinaster', 'shootHabit', 'multinodal', 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5): spring-shoots sometimes multinodal'],
  ['pinus-pinaster', 'needlesPerFascicle', 2, 'Flora of New Zealand vol. 4 (Webb et al. 1988)'],
  ['pinus-pinaster', 'needleLengthMm', { min: 60, max: 170 }, 'Flora of New Zealand vol. 4 (Webb et al. 1988): 60–170(–260) mm'],
  ['pinus-pinaster', 'vigour', 'high', 'Bean, Trees and Shrubs Online: grows with great rapidity as a young tree'],
  [
    'pinus-pinaster',
    'nativeRange',
    'Western Mediterranean and Atlantic Europe: Portugal to Greece and Algeria to Dalmatia, much extended by planting.',
    'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5)',
  ],
  ['pinus-pinaster', 'flushHabit', 'polycyclic', TRADE], // common practice, no published source
  [
    'pinus-pinaster',
    'wildingCaution',
    true,
    '“Conifers as invasive aliens: a global survey and predictive framework”, Diversity and Distributions 10: 321–331 (2004)',
  ],
  // Pinus pinea
  ['pinus-pinea', 'shootHabit', 'uninodal', 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5): spring-shoots uninodal'],
  ['pinus-pinea', 'needlesPerFascicle', 2, 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5)'],
  ['pinus-pinea', 'needleLengthMm', { min: 120, max: 200 }, 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5): leaves 12–20 cm'],
  [
    'pinus-pinea',
    'nativeRange',
    'The Mediterranean basin, from Portugal to Syria; the natural range is blurred by ancient planting.',
    'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5); Oregon State University Landscape Plants',
  ],
  ['pinus-pinea', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus ponderosa
  ['pinus-ponderosa', 'needlesPerFascicle', 3, 'Flora of New Zealand vol. 4 (Webb et al. 1988): 3(–4) per fascicle'],
  ['pinus-ponderosa', 'needleLengthMm', { min: 100, max: 250 }, 'Flora Europaea vol. 1 (Tutin et al. 1964): needles 10–25 cm'],
  ['pinus-ponderosa', 'hardinessZones', { min: 3, max: 7 }, 'Southern Utah University tree tour: zones 3–7'],
  [
    'pinus-ponderosa',
    'nativeRange',
    'Western North America, from British Columbia south through the western United States.',
    'Flora of North America vol. 2 (1993) (var. ponderosa)',
  ],
  ['pinus-ponderosa', 'flushHabit', 'single', TRADE], // common practice, no published source
  ['pinus-ponderosa', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Pinus pumila
  ['pinus-pumila', 'needlesPerFascicle', 5, 'Flora of China vol. 4 (1999)'],
  ['pinus-pumila', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus radiata
  ['pinus-radiata', 'needlesPerFascicle', 3, 'Flora of North America vol. 2 (1993)'],
  ['pinus-radiata', 'flushHabit', 'polycyclic', TRADE], // common practice, no published source
  [
    'pinus-radiata',
    'wildingCaution',
    true,
    '“Conifers as invasive aliens: a global survey and predictive framework”, Diversity and Distributions 10: 321–331 (2004); New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)',
  ],
  // Pinus resinosa
  ['pinus-resinosa', 'needlesPerFascicle', 2, 'Flora of North America vol. 2 (1993)'],
  ['pinus-resinosa', 'needleLengthMm', { min: 80, max: 150 }, 'Wisconsin State Herbarium, Flora of Wisconsin key to Pinus: leaves 8–15 cm'],
  ['pinus-resinosa', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus rigida
  [
    'pinus-rigida',
    'needlesPerFascicle',
    3,
    'Britton & Brown 1913, An Illustrated Flora of the Northern United States and Canada, 2nd ed., vol. 1: leaves in 3s',
  ],
  [
    'pinus-rigida',
    'needleLengthMm',
    { min: 75, max: 125 },
    'Britton & Brown 1913, An Illustrated Flora of the Northern United States and Canada, 2nd ed., vol. 1: leaves 3–5 in',
  ],
  ['pinus-rigida', 'flushHabit', 'polycyclic', TRADE], // common practice, no published source
  // Pinus strobus
  ['pinus-strobus', 'needlesPerFascicle', 5, 'Flora Europaea vol. 1 (Tutin et al. 1964)'],
  ['pinus-strobus', 'needleLengthMm', { min: 50, max: 140 }, 'Flora Europaea vol. 1 (Tutin et al. 1964)'],
  ['pinus-strobus', 'vigour', 'high', 'Missouri Botanical Garden Plant Finder: rapid-growing'],
  ['pinus-strobus', 'hardinessZones', { min: 3, max: 8 }, 'Missouri Botanical Garden Plant Finder: USDA zones 3–8'],
  ['pinus-strobus', 'nativeRange', 'South-eastern Canada and the eastern United States.', 'Missouri Botanical Garden Plant Finder'],
  ['pinus-strobus', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus sylvestris
  ['pinus-sylvestris', 'shootHabit', 'uninodal', 'Shaw 1914, The Genus Pinus (Arnold Arboretum Publ. 5): spring-shoots uninodal'],
  ['pinus-sylvestris', 'needlesPerFascicle', 2, 'Flora Europaea vol. 1 (Tutin et al. 1964)'],
  ['pinus-sylvestris', 'needleLengthMm', { min: 30, max: 70 }, 'Flora Europaea vol. 1 (Tutin et al. 1964): needles 3–7 cm'],
  ['pinus-sylvestris', 'vigour', 'moderate', 'Utah State University Extension Tree Browser: growth rate medium'],
  ['pinus-sylvestris', 'hardinessZones', { min: 2, max: 8 }, 'Utah State University Extension Tree Browser: USDA zones 2–8'],
  [
    'pinus-sylvestris',
    'nativeRange',
    'Northern and central Europe, extending south in the mountains to Spain, northern Italy and Macedonia; also across northern Asia.',
    'Flora Europaea vol. 1 (Europe only); the Asian part of the range from memory',
  ],
  ['pinus-sylvestris', 'flushHabit', 'single', TRADE], // common practice, no published source
  ['pinus-sylvestris', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Pinus tabuliformis
  ['pinus-tabuliformis', 'needlesPerFascicle', 2, 'Flora of China vol. 4 (1999)'],
  ['pinus-tabuliformis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pinus thunbergii
  ['pinus-thunbergii', 'shootHabit', 'uninodal', 'Shaw 1914, The Genus Pinus: spring-shoots uninodal'],
  ['pinus-thunbergii', 'needlesPerFascicle', 2, 'Flora of China vol. 4 (1999)'],
  ['pinus-thunbergii', 'needleLengthMm', { min: 60, max: 120 }, 'Flora of China vol. 4 (1999): needles 6–12 cm'],
  ['pinus-thunbergii', 'nativeRange', 'Coasts of Japan and South Korea.', 'Flora of China vol. 4 (1999): native to Japan and Korea'],
  ['pinus-thunbergii', 'flushHabit', 'double', TRADE], // common practice, no published source
  // Pinus uncinata
  ['pinus-uncinata', 'needlesPerFascicle', 2, 'Flora Europaea vol. 1 (Tutin et al. 1964)'],
  ['pinus-uncinata', 'flushHabit', 'single', TRADE], // common practice, no published source
  ['pinus-uncinata', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Pinus virginiana
  ['pinus-virginiana', 'needlesPerFascicle', 2, 'Flora of North America vol. 2 (1993)'],
  ['pinus-virginiana', 'needleLengthMm', { min: 20, max: 80 }, 'Flora of North America vol. 2 (1993): leaves 2–8 cm, strongly twisted'],
  ['pinus-virginiana', 'flushHabit', 'polycyclic', TRADE], // common practice, no published source
  // Podocarpus macrophyllus
  ['podocarpus-macrophyllus', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Pseudotsuga menziesii
  ['pseudotsuga-menziesii', 'needleLengthMm', { min: 15, max: 30 }, 'Flora of Oregon vol. 1 (2015), p. 125: leaves 1.5–3 cm'],
  ['pseudotsuga-menziesii', 'flushHabit', 'single', TRADE], // common practice, no published source
  ['pseudotsuga-menziesii', 'wildingCaution', true, 'New Zealand Wilding Conifer Management Strategy 2015–2030 (Ministry for Primary Industries, 2014)'],
  // Sciadopitys verticillata
  ['sciadopitys-verticillata', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Sequoia sempervirens
  ['sequoia-sempervirens', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Taxodium distichum
  [
    'taxodium-distichum',
    'needleLengthMm',
    { min: 5, max: 15 },
    'Gleason & Cronquist 1991, Manual of Vascular Plants of Northeastern United States and Adjacent Canada, 2nd ed.: leaves 5–15 mm',
  ],
  ['taxodium-distichum', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Taxus baccata
  ['taxus-baccata', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Taxus cuspidata
  ['taxus-cuspidata', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Thuja occidentalis
  ['thuja-occidentalis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Tsuga canadensis
  ['tsuga-canadensis', 'needleLengthMm', { min: 15, max: 20 }, 'Flora of North America vol. 2 (1993): leaves (5–)15–20(–25) mm'],
  ['tsuga-canadensis', 'flushHabit', 'single', TRADE], // common practice, no published source
  // Tsuga heterophylla
  ['tsuga-heterophylla', 'flushHabit', 'single', TRADE], // common practice, no published source
];
