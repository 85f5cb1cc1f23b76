/**
 * The Guides: how to run a fair trial, choose and place pots, and look after them safely.
 * Structured content in English and Spanish; pure data, no I/O, no React.
 *
 * Facts follow ../shared/REFERENCES.md (beside the checkout). Trade rules of thumb are
 * marked as such in the text itself ("rule of thumb", "common practice"), and no single
 * water-saving figure is promised.
 */
import type { CautionId, LocalizedText } from './cautions';

export type GuideBlock =
  | { kind: 'paragraph'; text: LocalizedText }
  /** 'bullets' for unordered points, 'steps' for a numbered procedure. */
  | { kind: 'list'; style: 'bullets' | 'steps'; items: readonly LocalizedText[] }
  /** A caution shown in full, where it belongs. Each caution is shown in full once. */
  | { kind: 'caution'; cautionId: CautionId }
  /** A pointer to cautions shown in full elsewhere in the Guides. */
  | { kind: 'seeCautions'; cautionIds: readonly CautionId[] };

export interface GuideSection {
  /** Anchor id, unique across all guides (kebab-case). */
  id: string;
  heading: LocalizedText;
  blocks: readonly GuideBlock[];
}

export interface Guide {
  /** Anchor id, unique across all guides (kebab-case). */
  id: string;
  title: LocalizedText;
  summary: LocalizedText;
  sections: readonly GuideSection[];
}

const p = (en: string, es: string): GuideBlock => ({ kind: 'paragraph', text: { en, es } });
const t = (en: string, es: string): LocalizedText => ({ en, es });
const bullets = (...items: LocalizedText[]): GuideBlock => ({ kind: 'list', style: 'bullets', items });
const steps = (...items: LocalizedText[]): GuideBlock => ({ kind: 'list', style: 'steps', items });
const caution = (cautionId: CautionId): GuideBlock => ({ kind: 'caution', cautionId });
const see = (...cautionIds: CautionId[]): GuideBlock => ({ kind: 'seeCautions', cautionIds });

export const fairTrialGuide: Guide = {
  id: 'fair-trial',
  title: t('Running a fair side-by-side trial', 'Cómo hacer un ensayo comparativo justo'),
  summary: t(
    'A trial compares two ways of watering the same crop. It is only as fair as its least matched pair of beds and its least honest log.',
    'Un ensayo compara dos formas de regar el mismo cultivo. Es tan justo como su par de camas menos parejo y su registro menos honesto.',
  ),
  sections: [
    {
      id: 'fair-trial-pairs',
      heading: t('Work in pairs', 'Trabaja en pares'),
      blocks: [
        p(
          'The unit of a trial is the pair: two beds made as alike as you can, one watered through buried pots (the treatment) and one watered at the surface (the control). Each pair gives one comparison, so more pairs give a firmer answer than bigger beds do.',
          'La unidad de un ensayo es el par: dos camas tan parecidas como puedas, una regada con ollas enterradas (el tratamiento) y otra regada en la superficie (el testigo). Cada par aporta una comparación, así que tener más pares da una respuesta más firme que tener camas más grandes.',
        ),
        p(
          'Write the question down before you plant, for example: "Do buried pots use less water than a watering can for the same tomato harvest?" Decide now what you will measure, and stick to it.',
          'Escribe la pregunta antes de sembrar, por ejemplo: "¿Las ollas enterradas gastan menos agua que la regadera para la misma cosecha de tomate?". Decide desde ahora qué vas a medir y no lo cambies a mitad de camino.',
        ),
        p(
          'As a rough guide, about ten pairs give an 80% chance of detecting a true difference as large as the typical scatter of the pair differences (one standard deviation), at the usual 5% level. Few home gardens have room for that, which is one reason cohorts pool gardens. The Planner works out a number from your own figures.',
          'Como referencia aproximada, unos diez pares dan un 80 % de probabilidad de detectar una diferencia real del tamaño de la dispersión típica de las diferencias entre pares (una desviación estándar), con el nivel habitual del 5 %. Pocos huertos caseros tienen espacio para tanto, y por eso los grupos juntan varios huertos. El Planificador calcula un número con tus propios datos.',
        ),
      ],
    },
    {
      id: 'fair-trial-random',
      heading: t('Assign treatments at random within each pair', 'Sortea el tratamiento dentro de cada par'),
      blocks: [
        p(
          'Once the beds are laid out, let chance decide which bed of each pair gets the pots: toss a coin, roll a die, or let Seepwise make the draw. Without meaning to, people tend to give the better-looking bed to the method they hope will win.',
          'Una vez armadas las camas, deja que el azar decida cuál cama de cada par lleva las ollas: tira una moneda, un dado o deja que Seepwise haga el sorteo. Sin darnos cuenta, solemos darle la cama más prometedora al método que queremos que gane.',
        ),
        p(
          'When a random number generator makes the draw, record its seed with the trial, so anyone can repeat the draw and see that nobody adjusted it. Do not draw again because you dislike the result.',
          'Si el sorteo lo hace un generador de números aleatorios, guarda la semilla junto con el ensayo, así cualquiera puede repetir el sorteo y comprobar que nadie lo arregló. No vuelvas a sortear porque no te gustó el resultado.',
        ),
      ],
    },
    {
      id: 'fair-trial-match',
      heading: t('Keep everything else the same', 'Que todo lo demás sea igual'),
      blocks: [
        p(
          'The only difference between the two beds of a pair should be how they are watered.',
          'La única diferencia entre las dos camas de un par debe ser la forma de regar.',
        ),
        bullets(
          t(
            'Same crop, same variety, same batch of seed or seedlings, planted on the same day.',
            'El mismo cultivo, la misma variedad, el mismo lote de semillas o plántulas, sembrados el mismo día.',
          ),
          t('Same bed size and the same number of plants.', 'El mismo tamaño de cama y la misma cantidad de plantas.'),
          t(
            'Matched soil: the same mix, compost and mulch in both beds.',
            'Suelo parejo: la misma mezcla, el mismo compost y el mismo acolchado en las dos camas.',
          ),
          t(
            'Matched sun: put the two beds of a pair side by side, away from walls, trees and downspouts that would favour one of them.',
            'Sol parejo: pon las dos camas de un par una al lado de la otra, lejos de muros, árboles y bajantes que favorezcan a una de ellas.',
          ),
          t('The same feeding, pest control, staking and pruning on both sides.', 'El mismo abonado, control de plagas, tutorado y poda en ambos lados.'),
          t(
            'If the garden changes from one end to the other (a slope, shade at one end), build each pair from two neighbouring beds. Then that change falls between pairs, where the comparison can allow for it, not inside them.',
            'Si el terreno cambia de un extremo a otro (una pendiente, sombra en una punta), forma cada par con dos camas vecinas. Así ese cambio queda entre pares, donde la comparación puede tenerlo en cuenta, y no dentro de ellos.',
          ),
        ),
      ],
    },
    {
      id: 'fair-trial-water',
      heading: t('Measure water honestly', 'Mide el agua con honestidad'),
      blocks: [
        p(
          'Water is what the trial is about, so every litre counts, on both sides.',
          'El agua es el tema del ensayo, así que cada litro cuenta, de los dos lados.',
        ),
        bullets(
          t(
            'Use a marked measuring jug or an inline water meter, never a guess by eye or by seconds of hose.',
            'Usa una jarra medidora graduada o un medidor en la manguera; nunca calcules a ojo ni por segundos de manguera.',
          ),
          t(
            'Log every refill of every pot, and every can or metered run on the control bed, on the day it happens.',
            'Anota cada relleno de cada olla, y cada regadera o riego medido en la cama testigo, el mismo día en que ocurre.',
          ),
          t(
            'Count the first fill of the pots and the water used to settle transplants in both beds.',
            'Cuenta el primer llenado de las ollas y el agua usada para asentar los trasplantes en ambas camas.',
          ),
          t(
            'Rain falls on both beds: note it in the weather, but do not add it to either side’s applied water.',
            'La lluvia cae en las dos camas: anótala en el clima, pero no la sumes al agua aplicada de ningún lado.',
          ),
          t(
            'If you spill or overfill, log what actually went in and add a note.',
            'Si se te derrama o desborda, anota lo que de verdad entró y agrega una nota.',
          ),
        ),
        p(
          'Watering the control the way you usually would is fine, but write the rule down (for example, "water when the top few centimetres are dry") and keep to it. A moisture probe or tensiometer reading now and then shows whether both beds were kept comparably moist.',
          'Regar el testigo como lo haces siempre está bien, pero escribe la regla (por ejemplo, "regar cuando los primeros centímetros estén secos") y respétala. Una lectura de vez en cuando con un sensor de humedad o un tensiómetro muestra si las dos camas se mantuvieron con humedad parecida.',
        ),
      ],
    },
    {
      id: 'fair-trial-harvest',
      heading: t('Weigh every pick', 'Pesa cada cosecha'),
      blocks: [
        bullets(
          t(
            'Weigh each pick bed by bed, on the same scale and in the same unit all season.',
            'Pesa cada cosecha por cama, con la misma balanza y en la misma unidad toda la temporada.',
          ),
          t(
            'Include small and damaged fruit; if you want both figures, record the unsellable weight separately.',
            'Incluye los frutos chicos y dañados; si quieres ambas cifras, anota aparte el peso de lo que no se puede vender.',
          ),
          t(
            'Do not skip the last straggling picks at the end of the season: they belong to the total.',
            'No te saltes las últimas cosechas flojas del final de la temporada: también cuentan en el total.',
          ),
        ),
        p(
          'Water-use efficiency divides the harvest by the water applied (kilograms per cubic metre, or grams per litre). It rewards saving water and penalises losing crop, so it is often a fairer summary than water alone.',
          'La eficiencia en el uso del agua divide la cosecha por el agua aplicada (kilogramos por metro cúbico, o gramos por litro). Premia el ahorro de agua y castiga la pérdida de cosecha, así que suele resumir el resultado mejor que el agua sola.',
        ),
      ],
    },
    {
      id: 'fair-trial-missing',
      heading: t('Missing days and gaps', 'Días sin registro y huecos'),
      blocks: [
        p(
          'Everyone misses a day. A missing record is not a zero: leave it blank and mark it missing rather than guessing or copying yesterday’s figure. If you refilled but forgot to log it, enter it later with a note that the amount is an estimate.',
          'A todos se nos pasa un día. Un dato que falta no es un cero: déjalo vacío y márcalo como faltante, en vez de adivinar o copiar la cifra de ayer. Si rellenaste pero olvidaste anotarlo, anótalo después con una nota que diga que la cantidad es estimada.',
        ),
        p(
          'Treat both beds of a pair alike. If you were away and neither got water, say so; if a neighbour watered only one, note it. A cracked pot or a bed lost to pests is part of the result: record what happened and when, and do not quietly drop the pair.',
          'Trata igual a las dos camas de un par. Si saliste de viaje y ninguna recibió agua, anótalo; si un vecino regó solo una, también. Una olla rajada o una cama perdida por plagas es parte del resultado: registra qué pasó y cuándo, y no elimines el par en silencio.',
        ),
      ],
    },
    {
      id: 'fair-trial-statistics',
      heading: t('What the statistics can and cannot say', 'Lo que la estadística puede y no puede decir'),
      blocks: [
        p(
          'Seepwise compares beds pair by pair: for each pair it takes the difference between the pot bed and the surface bed, then asks how consistent those differences are. The n in a result is the number of pairs, not the number of plants, pots or days.',
          'Seepwise compara las camas par por par: en cada par calcula la diferencia entre la cama con ollas y la cama con riego superficial, y luego mira qué tan constantes son esas diferencias. La n de un resultado es la cantidad de pares, no de plantas, ollas ni días.',
        ),
        p(
          'The paired t-test and its 95% confidence interval describe the average difference. The interval comes from a method that, over many repeated trials, would capture the true average difference about 95 times in 100. It is not a promise about any one garden. A wide interval is an honest way of saying you do not know much yet; with two or three pairs it will usually be wide, and a single pair gives no interval at all.',
          'La prueba t pareada y su intervalo de confianza del 95 % describen la diferencia promedio. El intervalo sale de un método que, si el ensayo se repitiera muchas veces, abarcaría la verdadera diferencia promedio unas 95 veces de cada 100. No es una promesa sobre ningún huerto en particular. Un intervalo ancho es una forma honesta de decir que todavía se sabe poco; con dos o tres pares suele ser ancho, y con un solo par no hay intervalo.',
        ),
        p(
          'An interval that includes zero does not show that the two methods are equal; it shows that this trial could not tell them apart.',
          'Un intervalo que incluye el cero no demuestra que los dos métodos sean iguales; muestra que este ensayo no alcanzó a distinguirlos.',
        ),
        p(
          'One garden in one season is one site. Its result belongs to that soil, that weather and that crop: a good answer for you, and a weak one for anyone else.',
          'Un huerto en una temporada es un solo sitio. Su resultado corresponde a ese suelo, ese clima y ese cultivo: una buena respuesta para ti y una respuesta débil para los demás.',
        ),
        p(
          'Never cut the season into days or weeks and treat each one as a pair. Days in the same beds are not independent (a bed that was wetter on Monday is still wetter on Tuesday), so counting them as replicates makes the interval look much narrower than the evidence allows.',
          'Nunca dividas la temporada en días o semanas para tratar cada uno como un par. Los días en las mismas camas no son independientes (una cama que estaba más húmeda el lunes lo sigue estando el martes), así que contarlos como repeticiones hace que el intervalo parezca mucho más angosto de lo que permiten los datos.',
        ),
        p(
          'That is why cohorts exist. Each garden contributes one estimate, and pooling many gardens, while allowing for real differences between them, shows how large the saving tends to be and how much it varies from place to place. Reported savings against surface watering vary widely, from around half the water in common garden experience to 70-84% in some field studies, so expect your own figure to differ from anyone else’s.',
          'Para eso existen los grupos. Cada huerto aporta una estimación, y al juntar muchos huertos, teniendo en cuenta las diferencias reales entre ellos, se ve qué tan grande suele ser el ahorro y cuánto cambia de un lugar a otro. Los ahorros informados frente al riego superficial varían mucho, desde alrededor de la mitad del agua según la experiencia habitual en huertos hasta un 70-84 % en algunos estudios de campo, así que es de esperar que tu cifra sea distinta a la de otros.',
        ),
      ],
    },
  ],
};

export const choosingPotsGuide: Guide = {
  id: 'choosing-pots',
  title: t('Choosing and placing pots', 'Cómo elegir y colocar las ollas'),
  summary: t(
    'A pot seeps only as well as its clay allows and waters only the soil it touches. Choose it, test it and bury it with care.',
    'Una olla filtra según lo que permite su barro y solo riega el suelo que toca. Elígela, pruébala y entiérrala con cuidado.',
  ),
  sections: [
    {
      id: 'pots-size',
      heading: t('Size for the bed', 'Un tamaño acorde a la cama'),
      blocks: [
        p(
          'Garden pots typically hold from about 1 to 20 litres. A small pot suits a container or a narrow row but empties quickly in the heat; a large one holds several days of water and wets a wider circle, but it is heavier, costs more and takes more digging.',
          'Las ollas de huerto suelen tener entre 1 y 20 litros, aproximadamente. Una olla chica sirve para una maceta o una hilera angosta, pero se vacía rápido con el calor; una grande guarda agua para varios días y moja un círculo más amplio, aunque pesa más, cuesta más y hay que cavar más.',
        ),
        p(
          'Choose a size you can keep up with: if you can only come every second day, the pot must hold at least two hot days of seepage. The seep test below tells you how fast each pot loses water.',
          'Elige un tamaño que puedas atender: si solo puedes ir cada dos días, la olla tiene que guardar al menos dos días calurosos de filtración. La prueba de filtración de más abajo te dice qué tan rápido pierde agua cada olla.',
        ),
      ],
    },
    {
      id: 'pots-shape',
      heading: t('Shape', 'Forma'),
      blocks: [
        p(
          'The classic olla has a round belly and a narrow neck. The belly gives plenty of wall for seepage; the narrow neck loses little to evaporation and is easy to cover. Tall, slim pots tend to water deeper soil, which suits deep-rooted crops; squat ones keep the water nearer the surface.',
          'La olla clásica tiene panza redonda y cuello angosto. La panza ofrece mucha pared para filtrar; el cuello angosto pierde poco por evaporación y es fácil de tapar. Las ollas altas y delgadas tienden a regar más hondo, lo que conviene a cultivos de raíz profunda; las bajas y anchas dejan el agua más cerca de la superficie.',
        ),
        p(
          'A twin-pot build, two unglazed flowerpots joined rim to rim with the bottom drainage hole plugged, is a cheap alternative, but the joint and the plug need a glue or sealant.',
          'Una olla de dos macetas, hecha con dos macetas de barro sin esmaltar unidas por el borde y con el agujero de abajo tapado, es una alternativa barata, pero la unión y el tapón necesitan pegamento o sellador.',
        ),
        see('twinPotAdhesive'),
      ],
    },
    {
      id: 'pots-clay',
      heading: t('Clay and firing', 'El barro y la cocción'),
      blocks: [
        p(
          'A pot works only if its wall is porous. Low-fire earthenware, fired to around cone 04 (about 1060 °C, or 1940 °F, on the standard cone chart), stays porous. Stoneware and porcelain are fired hotter and vitrify: the clay fuses and seepage slows to almost nothing.',
          'Una olla funciona solo si su pared es porosa. El barro cocido a baja temperatura, hasta alrededor del cono 04 (unos 1060 °C, o 1940 °F, según la tabla de conos habitual), sigue siendo poroso. El gres y la porcelana se cuecen más calientes y se vitrifican: el barro se funde y la filtración casi desaparece.',
        ),
        p(
          'Glaze or paint seals the wall too, so choose pots that are bare clay wherever they sit below the soil. Even among bare clay pots, seepage differs a great deal between makers, batches and clays; measurements of wall permeability in published studies differ by orders of magnitude. That is why each pot gets its own seep test.',
          'El esmalte o la pintura también sellan la pared, así que elige ollas de barro desnudo en toda la parte que va bajo tierra. Aun entre ollas sin esmaltar, la filtración cambia mucho según el alfarero, la hornada y el barro; en los estudios publicados, la permeabilidad de la pared varía en varios órdenes de magnitud. Por eso cada olla lleva su propia prueba de filtración.',
        ),
        see('kilnFiring'),
      ],
    },
    {
      id: 'pots-seep-test',
      heading: t('How to seep-test a pot', 'Cómo hacer la prueba de filtración'),
      blocks: [
        p(
          'A seep test measures how much water a pot loses in 24 hours. Measure by volume with a jug, or by weight: one litre of water weighs about one kilogram.',
          'La prueba de filtración mide cuánta agua pierde una olla en 24 horas. Puedes medir por volumen con una jarra o por peso: un litro de agua pesa alrededor de un kilo.',
        ),
        steps(
          t(
            'Soak a new pot in water for a day first, so the dry clay is wetted through; otherwise the first fill soaks into the wall and reads too high.',
            'Primero deja la olla nueva en remojo un día, para que el barro seco se moje por completo; si no, el primer llenado se va en empapar la pared y la medición sale muy alta.',
          ),
          t(
            'Fill the pot to a mark just below the neck and cover the opening so nothing evaporates from it.',
            'Llena la olla hasta una marca justo debajo del cuello y tapa la boca para que no se evapore agua por ahí.',
          ),
          t(
            'After 24 hours, top up to the mark from a measuring jug and record how much it took, with the day’s temperature.',
            'A las 24 horas, rellena hasta la marca con una jarra medidora y anota cuánto hizo falta, junto con la temperatura del día.',
          ),
          t('Repeat on two or three days and use the average.', 'Repite dos o tres días y usa el promedio.'),
        ),
        p(
          'Where you test changes the answer, so record which setting you used:',
          'El lugar donde haces la prueba cambia el resultado, así que anota cuál usaste:',
        ),
        bullets(
          t(
            'In air: the pot stands in the open and water evaporates from its whole outside wall. Quick, and good for comparing pots with one another, but it usually overstates what the pot loses in soil.',
            'Al aire: la olla queda a la intemperie y el agua se evapora por toda la pared exterior. Es rápido y sirve para comparar ollas entre sí, pero suele exagerar lo que la olla pierde bajo tierra.',
          ),
          t(
            'In saturated sand: the pot is buried in a bucket of sand kept wet to the top. Wet sand draws little water from the wall, so this shows the pot’s slow end and exposes pots that leak through cracks.',
            'En arena saturada: la olla se entierra en un balde con arena mojada hasta arriba. La arena húmeda le saca poca agua a la pared, así que muestra el mínimo de la olla y delata las que pierden por grietas.',
          ),
          t(
            'In the bed: the pot is buried where it will work. The most realistic setting, but the result depends on the soil, the weather and the plants, and it changes through the season.',
            'En la cama: la olla se entierra donde va a trabajar. Es lo más realista, pero el resultado depende del suelo, del clima y de las plantas, y cambia a lo largo de la temporada.',
          ),
        ),
        p(
          'One field study measured roughly 0.16 to 0.60 litres a day per pot; your own pots and soil will set your own figure.',
          'Un estudio de campo midió entre 0,16 y 0,60 litros por día por olla, aproximadamente; tus ollas y tu suelo darán tu propia cifra.',
        ),
      ],
    },
    {
      id: 'pots-spacing',
      heading: t('Spacing', 'Distancia entre ollas'),
      blocks: [
        p(
          'As a rule of thumb (common practice, not a measured law), a buried pot wets the soil out to about one pot radius beyond its wall. The wetted circle around a pot is then about twice the pot’s widest diameter across: a pot 30 cm wide at its belly wets a circle roughly 60 cm across.',
          'Como regla práctica (es costumbre entre quienes las usan, no una medición), una olla enterrada moja el suelo hasta más o menos un radio de olla más allá de su pared. Así, el círculo húmedo alrededor de la olla mide cerca del doble del diámetro máximo de la olla: una olla de 30 cm de ancho en la panza moja un círculo de unos 60 cm.',
        ),
        p(
          'Along a single row, the wetted circles just meet when pot centres are two diameters apart. On a grid, centres need to be no more than about 1.4 diameters apart to leave no dry patch in the middle of four pots. Plant inside the wetted circle, close to the wall, so young roots find the water quickly. The Planner draws a layout for your bed using the same rule of thumb.',
          'En una sola hilera, los círculos húmedos apenas se tocan cuando los centros de las ollas están a dos diámetros de distancia. En una cuadrícula, los centros no deben quedar a más de 1,4 diámetros, aproximadamente, para que no quede un parche seco entre cuatro ollas. Planta dentro del círculo húmedo, cerca de la pared, para que las raíces jóvenes encuentren el agua pronto. El Planificador dibuja la distribución de tu cama con la misma regla práctica.',
        ),
        p(
          'Soil changes this a lot: in sandy soil water tends to move down more than sideways, while clay soil tends to spread it wider. Check with a probe or a finger after the first week and adjust.',
          'El suelo cambia mucho esto: en suelo arenoso el agua tiende a bajar más que a extenderse, mientras que en suelo arcilloso tiende a abrirse más. Revisa con un sensor o con el dedo después de la primera semana y ajusta.',
        ),
      ],
    },
    {
      id: 'pots-burying',
      heading: t('Burying', 'Cómo enterrarlas'),
      blocks: [
        steps(
          t('Dig a hole a little wider than the pot.', 'Cava un hoyo un poco más ancho que la olla.'),
          t(
            'Set the pot so its neck stands a few centimetres above the finished soil surface. This keeps soil, mulch and runoff out of the water.',
            'Coloca la olla de modo que el cuello quede unos centímetros por encima del nivel final del suelo. Así no le entran tierra, acolchado ni agua de escorrentía.',
          ),
          t(
            'Backfill with the bed’s own soil, firming it gently all round so the wall touches soil everywhere. Water moves into the soil only where the two touch; air gaps stop it.',
            'Rellena con la misma tierra de la cama, apretándola suavemente alrededor para que la pared toque tierra por todos lados. El agua pasa al suelo solo donde hay contacto; los huecos de aire la frenan.',
          ),
          t(
            'Water the backfill to settle it, then fill the pot and mark its level.',
            'Riega el relleno para que se asiente, luego llena la olla y marca el nivel.',
          ),
        ),
      ],
    },
    {
      id: 'pots-lids',
      heading: t('Lids', 'Tapas'),
      blocks: [
        p(
          'Cover every pot. A lid, an upturned saucer, a tile or a flat stone cuts evaporation from the neck, keeps out soil, leaves and small animals, and gives mosquitoes nowhere to breed. Lift it only to check and refill.',
          'Tapa todas las ollas. Una tapa, un plato boca abajo, una teja o una piedra plana reduce la evaporación por el cuello, impide que entren tierra, hojas y animalitos, y no deja lugar para que se críen mosquitos. Levántala solo para revisar y rellenar.',
        ),
        see('openPotMosquitoes'),
      ],
    },
  ],
};

export const careGuide: Guide = {
  id: 'care',
  title: t('Care and cautions', 'Cuidados y precauciones'),
  summary: t(
    'Keeping pots seeping season after season, and the usual precautions where the work can hurt someone.',
    'Cómo mantener las ollas filtrando temporada tras temporada, y las precauciones habituales donde el trabajo puede dañar a alguien.',
  ),
  sections: [
    {
      id: 'care-refill',
      heading: t('Refilling', 'Rellenar'),
      blocks: [
        p(
          'In hot weather, refill every day or two (common practice rather than a measured rule); in cool weather, far less often. Do not leave pots empty for days: the soil around them dries out, the roots suffer, and minerals build up on the wall.',
          'Con calor, rellena cada uno o dos días (es la costumbre habitual, no una regla medida); con fresco, mucho menos. No dejes las ollas vacías por días: el suelo alrededor se seca, las raíces sufren y los minerales se acumulan en la pared.',
        ),
        p(
          'Each refill tells you something. If a pot suddenly empties much faster, look for a crack; if it slows down over several weeks, suspect clogging or a mineral crust.',
          'Cada relleno te dice algo. Si una olla de pronto se vacía mucho más rápido, busca una grieta; si se vuelve más lenta a lo largo de varias semanas, sospecha de poros tapados o de costra mineral.',
        ),
      ],
    },
    {
      id: 'care-season',
      heading: t('Frost and the end of the season', 'Heladas y fin de temporada'),
      blocks: [
        p(
          'Plan to lift the pots when the crop is finished, before the ground freezes.',
          'Planea sacar las ollas cuando termine el cultivo, antes de que se congele el suelo.',
        ),
        caution('frost'),
      ],
    },
    {
      id: 'care-pot-health',
      heading: t('Keeping the wall open', 'Cómo mantener los poros abiertos'),
      blocks: [
        p(
          'Fill pots with clean water only. Whatever floats or settles in the water ends up in the pores of the wall.',
          'Llena las ollas solo con agua limpia. Todo lo que flota o se asienta en el agua termina en los poros de la pared.',
        ),
        caution('cloggingFertiliser'),
        caution('mineralBuildUp'),
        caution('rootsIntrusion'),
      ],
    },
    {
      id: 'care-safety',
      heading: t('Where the work can hurt someone', 'Donde el trabajo puede dañar a alguien'),
      blocks: [
        p(
          'These are the usual precautions, not a full safety guide. Rules differ between countries, regions and towns, and Seepwise cannot know yours: when a caution sends you to local rules or a licensed professional, go.',
          'Estas son las precauciones habituales, no una guía de seguridad completa. Las normas cambian entre países, regiones y municipios, y Seepwise no puede saber cuáles te tocan: cuando una precaución te remite a la normativa local o a un profesional habilitado, hazle caso.',
        ),
        caution('twinPotAdhesive'),
        caution('greywater'),
        caution('kilnFiring'),
        caution('openPotMosquitoes'),
      ],
    },
  ],
};

/** The Guides in reading order. */
export const guides: readonly Guide[] = [fairTrialGuide, choosingPotsGuide, careGuide];

/** The anchor id of a caution shown in full in the Guides. */
export function cautionAnchor(id: CautionId): string {
  return `caution-${id.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;
}

/** Every caution id a guide refers to, in order of appearance, with repeats. */
export function cautionIdsInGuide(guide: Guide): CautionId[] {
  return guide.sections.flatMap((section) =>
    section.blocks.flatMap((block) => {
      if (block.kind === 'caution') return [block.cautionId];
      if (block.kind === 'seeCautions') return [...block.cautionIds];
      return [];
    }),
  );
}

/** Caution ids shown in full across all guides, in order of appearance, with repeats. */
export function cautionsShownInFull(all: readonly Guide[] = guides): CautionId[] {
  return all.flatMap((guide) => guide.sections.flatMap((section) => section.blocks.flatMap((block) => (block.kind === 'caution' ? [block.cautionId] : []))));
}
