package help

// The words of the Help screen. Texts are HTML (written by us, never from user input).
// Numbers quoted here come from core/MODEL.md and core/SOURCES.md, which name their sources.

const intro = `<h1>Help</h1>
<p class="help-lead">Saltcast plans a batch you dissolve hot and crystallize by cooling, a solution you make up to the mark, and the gases dissolved in water. Type on the left (or above); the answers update as you type. This help is part of the file and works without a network.</p>
<p class="help-safe"><strong>A planning aid, not a safety assessment.</strong> Read the SDS of every chemical you handle, and follow your local rules and licensed practice.</p>`

// BatchWords explains batch recipe keys in the words of the bench, where the table's short
// meaning is not enough. A key without an entry shows the table's own words.
var BatchWords = map[string]string{
	"name":                            "A name for this batch, printed at the top of the batch sheet and used when you save it.",
	"notes":                           "Anything the next person should know: where the solid came from, the vessel, what you saw. Printed on the batch sheet.",
	"solute":                          "What you dissolve. Type a formula (<code>KNO3</code>, <code>CuSO4·5H2O</code> or <code>CuSO4.5H2O</code>) or a common name (<em>blue vitriol</em>, <em>alum</em>) and tap one of the matches. Only the compounds in the built-in library are known, unless you give your own points below.",
	"charged_form":                    "The jar you actually weigh from: the anhydrous salt or one of its hydrates. A hydrate brings its own water into the batch, and the charge is worked out for that form.",
	"purity_pct":                      "The assay on the label. The charge is raised so that the pure compound comes out right; the rest is taken as inert and insoluble (it stays with the solid, it does not change the solubility).",
	"custom":                          "For a compound that is not in the library: give at least three points of your own solubility measurements, and Saltcast plans with a curve through them. It knows nothing of that compound's hazards.",
	"custom.points":                   "Your measurements, one a line: the temperature in °C and the grams of anhydrous compound that dissolve in 100 g of water there, e.g. <q>20; 31,6</q>. At least 3 and at most 200 points.",
	"custom.model":                    "How the curve is drawn through your points: smoothly through every point (PCHIP, the default), or fitted by the van 't Hoff, Apelblat or polynomial equation; the fit's quality is shown under the points.",
	"water_g":                         "The water you weigh in, not counting water that comes with a hydrate.",
	"water_mL":                        "The water you measure by volume; it is turned into grams with the density of pure water at the temperature you measured it.",
	"water_temp_C":                    "The temperature of the water when you measured its volume (20 °C if you leave it empty).",
	"evaporated_water_g":              "Water lost to boiling or evaporation before you filter. It concentrates the liquor and raises the crop.",
	"dissolve_temp_C":                 "The temperature at which everything is dissolved, before cooling. Above 50 °C the plan carries a hot-liquid caution.",
	"saturation_pct":                  "How close to saturation the batch is at the process temperature: 100 % is the most that dissolves there. The charge to weigh is worked out from it.",
	"charge_g":                        "The mass you weighed (or will weigh), if you start from a fixed amount instead of a % of saturation.",
	"clear_down_to_C":                 "For a stock that must stay clear: the coldest the solution will see (a cold room, a winter bench). Saltcast gives the most solute that stays dissolved down to there, less the safety margin.",
	"clear_margin_K":                  "How many kelvin below the saturation point the coldest temperature must stay (2 K if empty). A larger margin gives a weaker, safer stock.",
	"cool_to_C":                       "The temperature you cool to and filter at. The crop, the mother liquor and the cooling duty are worked out for it.",
	"seed_at_C":                       "If you cool without seeds to this temperature and then add seed crystals, the plan also shows what happens in an insulated vessel: the crystals release heat and the batch warms.",
	"metastable_width_K":              "How far below saturation an unseeded batch of this compound usually stays clear, from your own experience. Saltcast does not know it; without it no nucleation temperature is given.",
	"cooling_time_min":                "How long you want the cooling to take; the cooling programme (a table of set-points) and the mean cooling power need it.",
	"liquor_heat_capacity_kJ_per_kgK": "If you have measured the heat capacity of this liquor, give it here; otherwise a built-in estimate is used (shown beside the batch heat capacity).",
	"vessel_heat_capacity_J_per_K":    "The heat the vessel and stirrer take up per kelvin (borosilicate glass takes about 0.8 J per gram per kelvin, from memory). It adds to the cooling duty and damps the insulated jump.",
}

// PrepWords explains preparation keys, as BatchWords.
var PrepWords = map[string]string{
	"solute":              "What the solution is of, as on the batch screen.",
	"concentration":       "The strength you want, in the unit beside it.",
	"concentration_unit":  "mol/L and mmol/L (per litre of solution), g/L and mg/L, % w/v (g per 100 mL of solution), % w/w (g per 100 g of solution) or mol/kg (per kg of water, molality).",
	"final_volume_mL":     "The volume you make up to the mark in a volumetric flask, at the make-up temperature.",
	"solvent_g":           "All the water in the finished solution, including any water a hydrate brings in.",
	"stock_concentration": "To dilute a stronger solution of the same compound instead of weighing solid: its strength, in the stock unit.",
	"store_at_C":          "Where the bottle will be kept. Saltcast warns if the solution would crystallize or freeze there, and prints the lowest safe storage temperature on the label.",
}

// Output is one result of the batch screen and sheet: Key is the key the page shows it under
// (data-key) and the command line writes.
type Output struct {
	Key, Label, Text string
}

// Outputs explain the batch results, in the order the sheet lists them.
var Outputs = []Output{
	{"charge_g", "Charge to weigh", "The mass to weigh from the jar you named (its form and purity included)."},
	{"charged_form", "Form weighed", "The form the charge is for: anhydrous or a hydrate."},
	{"water_g", "Water added", "The water you put in, in grams."},
	{"impurity_g", "Impurity in the charge", "What the purity you gave leaves of the charge that is not the compound. Saltcast takes it as inert and insoluble: it does not change the solubility and ends in the filter cake with the crystals. If your impurity dissolves or reacts, the figures do not cover it."},
	{"hydrate_water_g", "Water brought in by the hydrate", "The water of crystallization in the charge; it joins the solvent once dissolved."},
	{"saturation_pct", "Saturation at process temperature", "How much of what could dissolve at the process temperature is in the batch."},
	{"min_water_g", "Least water that dissolves the charge", "Less water than this at the process temperature leaves solid undissolved."},
	{"saturation_temp_C", "Clear above (onset of crystallization)", "The saturation temperature: above it the batch is clear; cooled below it, crystals can start to form. The number to watch while cooling."},
	{"crystals_g", "Crystals at target", "The dry crop expected at the target temperature, at equilibrium (enough time and seed). Wet crystals weigh more."},
	{"crystal_phase", "Crystals are", "Which solid comes out at the target: the stable hydrate there, which may differ from the one you weighed."},
	{"yield_pct", "Yield", "The crop as a share of the compound you put in."},
	{"liquor_g", "Mother liquor", "The saturated liquid left after filtering, in grams."},
	{"liquor_g_per_100g_water", "Mother liquor strength", "What is still dissolved in the mother liquor, per 100 g of its water: the solubility at the target."},
	{"dissolution_heat_kJ", "Heat on dissolving", "Heat the batch takes up (+) or gives off (−) as the charge dissolves. Not given when the library has no enthalpy for the compound. Rough: it uses the value at infinite dilution."},
	{"dissolution_temp_change_K", "Temperature change on dissolving", "How far the batch would cool (or warm) while dissolving if nothing heated it."},
	{"crystallization_heat_kJ", "Heat of crystallization", "Heat released by the crystals as they form; it adds to the cooling duty."},
	{"heat_basis", "Heat of crystallization, basis", "Which estimate the heat comes from. Where estimates disagree the larger (design) value is used, the safe side for sizing the cooling."},
	{"crystal_enthalpy_kJ_per_mol", "Heat per mol of crystals, design value", "The larger of the estimates, used for the cooling duty."},
	{"crystal_enthalpy_low_kJ_per_mol", "Heat per mol of crystals, lowest estimate", "The smaller estimate, shown so you can see the spread."},
	{"crystallization_heat_low_kJ", "Heat of crystallization, lowest estimate", "The heat with the smaller estimate."},
	{"heat_capacity_kJ_per_K", "Batch heat capacity", "Heat needed to warm the whole batch by one kelvin, with the model named beside it."},
	{"heat_capacity_model", "Heat-capacity model", "How the batch heat capacity was estimated."},
	{"ice_heat_kJ", "Heat released by freezing ice", "Below 0 °C, ice that freezes out gives off heat; it is part of the cooling duty."},
	{"cooling_duty_kJ", "Cooling duty", "All the heat to take out between the process temperature and the target: the liquor cooling down plus the heat of the crystals (and of any ice). Heat lost to the room and by evaporation is not counted."},
	{"cooling_power_W", "Mean cooling power", "The cooling duty spread over the cooling time you gave."},
	{"nucleation_temp_C", "Unseeded crystals expected near", "The saturation temperature less the metastable width you gave."},
	{"seed_temp_C", "Suggested seeding temperature", "1 K below saturation (common practice)."},
	{"seed_low_g", "Seed mass, from", "1 % of the expected crop (common practice)."},
	{"seed_high_g", "Seed mass, to", "2 % of the expected crop (common practice)."},
	{"adiabatic_end_temp_C", "Seeded, insulated: ends at", "If you seed at the seeding temperature in a well-insulated vessel, the crystals' heat warms the batch to about here. An upper bound: a real vessel loses heat."},
	{"adiabatic_crystals_g", "Seeded, insulated: crystals", "The crystals formed before the warming stops them."},
	{"adiabatic_rise_K", "Seeded, insulated: temperature jump", "How far the batch warms after seeding."},
	{"adiabatic_held_at_transition", "Held at a transition?", "Whether the warming stops where the seeded solid stops being stable (sodium acetate trihydrate at 58 °C), or earlier."},
	{"adiabatic_phase", "Seeded, insulated: crystals are", "The solid that grows on the seeds."},
	{"adiabatic_crystals_low_g", "Seeded, insulated: crystals, lowest heat", "The crystals with the smaller heat estimate."},
	{"adiabatic_end_low_temp_C", "Seeded, insulated: end, lowest heat", "The end temperature with the smaller heat estimate."},
	{"freezing_point_C", "Solution freezes at", "Below this, ice forms in the solution as made (for compounds with freezing data)."},
	{"ice_g", "Ice at target", "Ice frozen out at a target below the freezing point; the liquor concentrates."},
	{"eutectic_C", "Freezes solid below", "The eutectic: below it ice and salt freeze out together and no liquor is left."},
	{"eutectic_phase", "At the eutectic, ice freezes out with", "The salt form that freezes out with the ice."},
	{"frozen_solid", "Frozen solid at target", "The target lies below the eutectic: the whole batch freezes."},
}

const prepIntro = `<p>The Make up screen works out a solution made to the mark (or by mass) from solid on the shelf or from a stock, using the density of the solution where the library has it.</p>`

const prepResults = `<h3>Make up: what you get</h3><dl class="help-list">
<dt>Weigh</dt><dd>The mass of the form on the shelf to weigh, for its purity.</dd>
<dt>Measure of the stock</dt><dd>The volume of stock to measure when you dilute.</dd>
<dt>Water, about</dt><dd>Roughly the water needed; make up to the mark rather than trusting this number.</dd>
<dt>Solution, Density</dt><dd>The volume and mass of the finished solution, and its density with its uncertainty.</dd>
<dt>Of saturation</dt><dd>How close the solution is to saturation at the make-up temperature.</dd>
<dt>Keep above, Crystallizes below, Freezes at</dt><dd>The lowest temperature the bottle can be stored at without crystals or ice forming, and why.</dd>
<dt>Concentration in every unit</dt><dd>The same solution in every unit, to copy onto a label or a method.</dd>
</dl>`

const gas = `<section class="panel help-part" id="help-gas"><h2>Gases</h2>
<p>Warm water holds less gas than cold water. The Gases screen gives the oxygen a dissolved-oxygen meter should read at 100 % saturation, for the water temperature, salinity and air pressure of the day, the other air gases, and how much gas comes out when the water is heated.</p>
<ul>
<li>Give the <strong>station pressure</strong>, what a barometer on site reads, not the sea-level pressure of a weather report; at 500 m the two differ by about 6 %.</li>
<li>Salinity is for sea and brackish water (practical salinity, about g of salt per kg). Nitrogen, argon and methane are for fresh water only.</li>
<li>Carbon dioxide results are the dissolved gas only; bicarbonate and carbonate depend on pH and alkalinity.</li>
<li>Outgassing on heating is for fresh water; for a salt solution it is an upper estimate. Real bubbles need a nucleation site and appear a little later than the temperature given.</li>
</ul></section>`

const limits = `<section class="panel help-part" id="help-limits"><h2>Assumptions and limits</h2>
<ul>
<li><strong>Equilibrium, not speed.</strong> Crops and liquors are what the batch reaches given enough time, stirring and seed. Real batches often end a little supersaturated, and wet crystals hold liquor. Growth rates, caking and the time a batch takes are not modelled.</li>
<li><strong>One compound in pure water.</strong> Other dissolved salts (tap-water hardness, mixed brines, seawater) change the solubility and are not taken into account.</li>
<li><strong>Impurities are inert and insoluble.</strong> The purity raises the charge; a soluble impurity would instead stay in the mother liquor and may change the solubility.</li>
<li><strong>Stable solids only.</strong> The solid that forms is the stable one at the target. Metastable hydrates, oiling out and mixed crystals are not predicted.</li>
<li><strong>Within the data.</strong> Each curve covers a temperature range. Just outside it (up to 5 K) you get a warning that the value is extrapolated; further out Saltcast refuses rather than guess. Where sources disagree the data carry a caution.</li>
<li><strong>Heat figures are estimates.</strong> The plan names the basis of its heat of crystallization; a fallback basis can be off by 30 % or more either way, so the design value is the larger one. The heat on dissolving uses the value at infinite dilution and is rough.</li>
<li><strong>Below 0 °C and above 100 °C.</strong> For compounds with freezing data the plan gives the ice and the eutectic; otherwise it warns. Above 100 °C it warns that the liquor may boil; the boiling-point rise is not computed.</li>
<li><strong>Rules of thumb</strong> (seed 1 K below saturation, 1–2 % seed, the cubic cooling programme) are starting points to adjust on the bench, marked as common practice.</li>
<li><strong>Bad input is refused, never guessed.</strong> A value Saltcast cannot use is marked beside its field with what is allowed, and the last good results stay on screen, marked as such, until you correct it.</li>
</ul></section>`

const data = `<section class="panel help-part" id="help-data"><h2>Where the data come from</h2>
<p>Every result lists its sources under the results (Curve and sources) and on the batch sheet. In short:</p>
<ul>
<li>Solubility curves, hydrates and their transition temperatures, freezing points and solution densities: mainly the CRC Handbook of Chemistry and Physics and Perry's Chemical Engineers' Handbook, with Seidell-type tables; a few values are marked “from memory” until checked against the printed source.</li>
<li>Heats of solution: the CRC Handbook's enthalpies of solution at infinite dilution (Parker, 1965); activity corrections by the Pitzer model where parameters exist; heats of fusion of hydrates from the literature on heat storage.</li>
<li>Water: density (Kell, 1975), heat capacity and vapour pressure (IAPWS).</li>
<li>Gases: oxygen by Benson &amp; Krause (1984) with Garcia &amp; Gordon (1992) as a check; carbon dioxide by Weiss (1974); Henry's law constants from Sander (2015) and the IAPWS correlation; pressure from altitude by the U.S. Standard Atmosphere 1976.</li>
<li>Cooling programme: Mullin &amp; Nývlt (1971). Seeding: common practice.</li>
<li>Your own compound: the points you typed and the source you name.</li>
</ul>
<p>The demo recipes are invented examples.</p></section>`

const safety = `<section class="panel help-part" id="help-safety"><h2>Safety</h2>
<ul class="cautions">
<li>Read the SDS of every chemical before you weigh it, and follow your local rules and licensed practice. Saltcast's cautions are reminders, not a safety assessment.</li>
<li>Hot liquids (the plan warns above 50 °C): use heat-resistant glassware, eye protection and gloves; never close a heated vessel.</li>
<li>Strong heat on dissolving or crystallizing (a swing above 10 K in an insulated vessel): add the solid in portions, stir, and have cooling ready.</li>
<li>Oxidizers (nitrates, dichromates, permanganates…): keep them away from organic material and reducing agents.</li>
<li>Toxic salts (those marked DANGER): follow the SDS for handling, and collect mother liquor and rinses for proper disposal; never pour them down the drain.</li>
<li>Your own compound: Saltcast knows nothing of its hazards.</li>
</ul></section>`
