/**
 * Safety and care cautions shown beside forms and in the Guides, in English and Spanish.
 *
 * Pure data plus one pure mapping (`cautionFor`): no I/O, no React. Every caution ends with a
 * `defersTo` line that sends the reader to local rules and licensed practice; Seepwise never
 * gives legal or medical rulings.
 */
import type { z } from 'zod';
import type { languageSchema } from '../schemas/auth';

export type Language = z.infer<typeof languageSchema>;

/** One piece of text in every language the product speaks. */
export type LocalizedText = Record<Language, string>;

export const CAUTION_IDS = [
  'greywater',
  'twinPotAdhesive',
  'kilnFiring',
  'frost',
  'openPotMosquitoes',
  'rootsIntrusion',
  'cloggingFertiliser',
  'mineralBuildUp',
] as const;

export type CautionId = (typeof CAUTION_IDS)[number];

/** 'warning': people or food can be harmed. 'info': the pot or the trial can be harmed. */
export type CautionSeverity = 'warning' | 'info';

export interface Caution {
  id: CautionId;
  title: LocalizedText;
  /** Two to four short sentences. */
  body: LocalizedText;
  /** The "check your local rules / licensed practice" line. */
  defersTo: LocalizedText;
  severity: CautionSeverity;
}

export const cautions = {
  greywater: {
    id: 'greywater',
    severity: 'warning',
    title: {
      en: 'Greywater in pots that feed food crops',
      es: 'Aguas grises en ollas que riegan cultivos comestibles',
    },
    body: {
      en: 'Used household water can carry germs, soap residues and salts. Never use toilet water, and avoid kitchen-sink water, which is greasy and full of food scraps. Filter out lint and particles first, or the pot walls will clog, and keep the water away from the parts of plants you eat.',
      es: 'El agua ya usada en casa puede llevar microbios, restos de jabón y sales. Nunca uses agua del inodoro y evita la del fregadero de la cocina, que trae grasa y restos de comida. Fíltrala antes para quitar pelusa y partículas, o se taparán los poros de la olla, y que no toque las partes de la planta que se comen.',
    },
    defersTo: {
      en: 'Whether and how greywater may be reused differs from place to place: check your local rules and health authority first, and use a licensed installer where a system is required.',
      es: 'Lo que está permitido con las aguas grises cambia de un lugar a otro: consulta primero la normativa local y a la autoridad sanitaria, y contrata a un instalador autorizado si se exige un sistema.',
    },
  },
  twinPotAdhesive: {
    id: 'twinPotAdhesive',
    severity: 'warning',
    title: {
      en: 'Glues and sealants in twin-pot builds',
      es: 'Pegamentos y selladores en ollas de dos macetas',
    },
    body: {
      en: 'Joining two flowerpots rim to rim and plugging the drainage hole puts glue or sealant in constant contact with the water your food crops drink. Some products can release chemicals into that water. Choose one that its maker states is suitable for drinking-water contact once cured, let it cure fully, and rinse the pot before use.',
      es: 'Al unir dos macetas por el borde y tapar el agujero de drenaje, el pegamento o sellador queda siempre en contacto con el agua que toman tus cultivos. Algunos productos pueden soltar sustancias químicas en esa agua. Elige uno que el fabricante declare apto para contacto con agua potable una vez curado, deja que cure por completo y enjuaga la olla antes de usarla.',
    },
    defersTo: {
      en: "Read the product's safety data sheet and check your local rules on materials in contact with food and drinking water; when in doubt, use a one-piece pot.",
      es: 'Lee la hoja de seguridad del producto y revisa la normativa local sobre materiales en contacto con alimentos y agua potable; si tienes dudas, usa una olla de una sola pieza.',
    },
  },
  kilnFiring: {
    id: 'kilnFiring',
    severity: 'warning',
    title: {
      en: 'Firing your own pots',
      es: 'Si cueces tus propias ollas',
    },
    body: {
      en: 'Kilns and pit fires reach around 1000 °C and more, enough to cause severe burns and to set nearby material alight. Firing gives off smoke and fumes, including carbon monoxide, so it needs good ventilation. Pots that still hold moisture can burst in the fire; let them dry completely first.',
      es: 'Los hornos de cerámica y las quemas a cielo abierto superan los 1000 °C, lo bastante para causar quemaduras graves y encender lo que esté cerca. La cocción suelta humo y gases, entre ellos monóxido de carbono, así que necesita buena ventilación. Las piezas que aún tienen humedad pueden estallar en el fuego; deja que sequen por completo.',
    },
    defersTo: {
      en: "Follow the kiln maker's instructions, have a qualified electrician install electric kilns, and check local fire and burn rules before any open firing; a community pottery studio is often the safer choice.",
      es: 'Sigue las instrucciones del fabricante del horno, pide a un electricista certificado que instale los hornos eléctricos y revisa las normas locales sobre fuego y quemas antes de cocer al aire libre; un taller de cerámica comunitario suele ser la opción más segura.',
    },
  },
  frost: {
    id: 'frost',
    severity: 'info',
    title: {
      en: 'Frost cracks pots',
      es: 'Las heladas rajan las ollas',
    },
    body: {
      en: 'A porous wall soaked with water splits when that water freezes and expands. Empty and lift your pots before the first frost, let them dry, and store them upside down under cover. A pot that may have frozen should get a new seep test before the next season; a hairline crack leaks far faster than the clay seeps.',
      es: 'Una pared porosa empapada se raja cuando el agua que contiene se congela y se expande. Vacía y saca tus ollas antes de la primera helada, déjalas secar y guárdalas boca abajo bajo techo. Si una olla pudo haberse congelado, vuelve a hacerle la prueba de filtración antes de la próxima temporada: una grieta fina deja salir el agua mucho más rápido que el barro.',
    },
    defersTo: {
      en: 'Frost dates vary a lot by place and year: check your local forecast and the first-frost dates published for your area.',
      es: 'Las fechas de helada cambian mucho según el lugar y el año: revisa el pronóstico local y las fechas de primeras heladas publicadas para tu zona.',
    },
  },
  openPotMosquitoes: {
    id: 'openPotMosquitoes',
    severity: 'warning',
    title: {
      en: 'Open pots can breed mosquitoes',
      es: 'Las ollas destapadas pueden criar mosquitos',
    },
    body: {
      en: 'Standing water in an uncovered neck is an easy place for mosquitoes to lay eggs, and in warm weather larvae can become biting adults within days. Some mosquitoes spread disease. Keep every pot covered with a lid, tile or flat stone, and check for larvae when you refill.',
      es: 'El agua quieta en el cuello de una olla destapada es un lugar fácil para que los mosquitos pongan huevos, y con calor las larvas pueden volverse adultos que pican en pocos días. Algunos mosquitos transmiten enfermedades. Mantén cada olla tapada con una tapa, una teja o una piedra plana, y revisa si hay larvas cada vez que la rellenes.',
    },
    defersTo: {
      en: 'Follow your local health authority’s advice on mosquitoes and standing water, which may include local rules for gardens.',
      es: 'Sigue las indicaciones de la autoridad sanitaria local sobre mosquitos y agua estancada, que pueden incluir normas locales para huertos y jardines.',
    },
  },
  rootsIntrusion: {
    id: 'rootsIntrusion',
    severity: 'info',
    title: {
      en: 'Roots find the water',
      es: 'Las raíces buscan el agua',
    },
    body: {
      en: 'Crop roots gather around the pot wall; that is the point. Tree roots and vigorous or invasive plants, though, can wrap a pot, grow into its neck through a gap in the lid, or crack it. Keep pots away from trees and hedges, and lift them at the end of the season.',
      es: 'Las raíces del cultivo se juntan alrededor de la pared de la olla, y para eso está. Pero las raíces de árboles y de plantas vigorosas o invasoras pueden envolverla, meterse por el cuello si la tapa deja un hueco, o rajarla. Aleja las ollas de árboles y cercos vivos, y sácalas al terminar la temporada.',
    },
    defersTo: {
      en: 'Ask your local extension office which plants are invasive in your area, and check local rules on where buried cables and pipes run before you dig.',
      es: 'Pregunta en la oficina local de extensión agrícola qué plantas son invasoras en tu zona, y revisa la normativa local sobre cables y tuberías enterrados antes de cavar.',
    },
  },
  cloggingFertiliser: {
    id: 'cloggingFertiliser',
    severity: 'info',
    title: {
      en: 'Fertiliser and compost tea clog the wall',
      es: 'El fertilizante y el té de compost tapan los poros',
    },
    body: {
      en: 'Particles from granules, manure or compost tea, and the slime that microbes grow on them, block the pores, so the pot seeps less each week. Feed at the soil surface instead. If you do add a fully dissolved, filtered fertiliser to the pot, give the control bed the same feed and write it in the log, or the trial no longer compares watering alone.',
      es: 'Las partículas de fertilizante granulado, estiércol o té de compost, y la baba que forman los microbios sobre ellas, tapan los poros y la olla filtra menos cada semana. Mejor abona en la superficie del suelo. Si de todos modos echas en la olla un fertilizante bien disuelto y filtrado, dale la misma dosis a la cama testigo y anótalo en el registro; si no, el ensayo ya no compara solo la forma de regar.',
    },
    defersTo: {
      en: 'Follow the product label and any local rules on fertiliser use near wells, streams and drains.',
      es: 'Sigue la etiqueta del producto y la normativa local sobre el uso de fertilizantes cerca de pozos, arroyos y desagües.',
    },
  },
  mineralBuildUp: {
    id: 'mineralBuildUp',
    severity: 'info',
    title: {
      en: 'Hard water leaves a crust',
      es: 'El agua dura deja costra',
    },
    body: {
      en: 'As water seeps out, the minerals it carries stay behind, and a pot left low for days concentrates them on the wall. Over seasons a white crust forms and seepage slows. Keep pots topped up, scrub them with a stiff brush when you lift them, and seep-test again if refills start lasting much longer.',
      es: 'A medida que el agua se filtra, los minerales que trae se quedan, y una olla que pasa días casi vacía los concentra en la pared. Con las temporadas se forma una costra blanca y la filtración se vuelve más lenta. Mantén las ollas llenas, cepíllalas con un cepillo duro cuando las saques y repite la prueba de filtración si el agua empieza a durar mucho más.',
    },
    defersTo: {
      en: 'Your local water supplier can tell you how hard your water is; if you use cleaning products on the pots, follow their label and local disposal rules.',
      es: 'Tu proveedor local de agua puede decirte qué tan dura es; si usas productos de limpieza en las ollas, sigue la etiqueta y las normas locales para desecharlos.',
    },
  },
} as const satisfies { [K in CautionId]: Caution & { id: K } };

/** Every caution in catalogue order. */
export const cautionList: readonly Caution[] = CAUTION_IDS.map((id) => cautions[id]);

export function isCautionId(value: string): value is CautionId {
  return (CAUTION_IDS as readonly string[]).includes(value);
}

export function getCaution(id: CautionId): Caution {
  return cautions[id];
}

/**
 * Form choices that can call for a caution. Every field is optional so any form (pot shelf,
 * trial setup, garden, Round) can pass what it has; an unknown or empty field raises nothing.
 */
export interface CautionContext {
  /** Where the water comes from, e.g. 'mains', 'rain', 'well', 'greywater'. */
  waterSource?: string | null;
  /** How the pot was made, e.g. 'bought', 'thrown', 'twin-pot'. */
  potMake?: string | null;
  /** A pyrometric cone the grower entered (e.g. '04'); any value means they fire pots. */
  firingCone?: string | number | null;
  /** A firing temperature the grower entered, °C; any value means they fire pots. */
  firingTemperatureC?: number | null;
  /** True when the grower says they fire their own pots. */
  selfFired?: boolean | null;
  /** The lowest temperature expected or recorded at the garden, °C. */
  minTemperatureC?: number | null;
  /** Whether the pot has a lid; only an explicit false raises the mosquito caution. */
  lid?: boolean | null;
  /** True when fertiliser, compost tea or similar goes into the pot water. */
  fertiliserAdded?: boolean | null;
}

function filled(value: string | number | null | undefined): boolean {
  if (value === null || value === undefined) return false;
  if (typeof value === 'number') return Number.isFinite(value);
  return value.trim() !== '';
}

/**
 * The cautions a set of form choices calls for, in catalogue order, each at most once.
 */
export function cautionFor(context: CautionContext): CautionId[] {
  const raised = new Set<CautionId>();
  if (context.waterSource?.trim().toLowerCase() === 'greywater') raised.add('greywater');
  if (context.potMake?.trim().toLowerCase() === 'twin-pot') raised.add('twinPotAdhesive');
  if (filled(context.firingCone) || filled(context.firingTemperatureC) || context.selfFired === true) raised.add('kilnFiring');
  const minT = context.minTemperatureC;
  if (typeof minT === 'number' && Number.isFinite(minT) && minT <= 0) raised.add('frost');
  if (context.lid === false) raised.add('openPotMosquitoes');
  if (context.fertiliserAdded === true) raised.add('cloggingFertiliser');
  return CAUTION_IDS.filter((id) => raised.has(id));
}
