/**
 * The results file of `cellbasis calc --json`: one object with every number of the design basis.
 * This zod schema is the single definition: the TypeScript type is inferred from it and the JSON
 * Schema in schema/results.schema.json is generated from it (scripts/write-schema.ts). Every
 * quantity carries its unit in its key (`_K`, `_bar`, `_V`, `_W`, `_mol_per_s`, `_kg_per_h`,
 * `_Nm3_per_h` at 0 °C and 1 atm, `_kWh_per_kg`; fractions are plain numbers from 0 to 1).
 */
import { z } from 'zod';
import { findingSchema } from './findings.ts';
import { IONS, MODES } from '../electrochem/technologies.ts';
import { hazardAssessmentSchema } from '../hazards/types.ts';
import { DEGRADED_QUANTITIES } from '../basis/types.ts';

const num = (description: string) => z.number().describe(description);
const nullableNum = (description: string) => z.number().nullable().describe(description);
const fractions = z.record(z.string(), z.number()).describe('mole fractions by species label');

const streamSchema = z
  .object({
    id: z.string().describe('stream id: fuel-feed, pre-reformer-outlet, fuel-inlet, fuel-outlet, air-inlet, air-outlet'),
    name: z.string(),
    temperature_K: num('temperature'),
    pressure_bar: num('absolute pressure'),
    flow_mol_per_s: num('total molar flow, gas and liquid'),
    gasFlow_mol_per_s: num('molar flow of the gas phase'),
    massFlow_kg_per_h: num('mass flow'),
    normalVolume_Nm3_per_h: num('gas volume flow at normal conditions, 0 °C and 1 atm (101.325 kPa)'),
    enthalpyFlow_W: num('Σ ṅ h(T), heats of formation included (NASA convention)'),
    moleFractions: fractions.describe('gas-phase mole fractions, every species'),
    speciesFlows_mol_per_s: z.record(z.string(), z.number()).describe('molar flow of every species; liquid water as "H2O(L)"'),
  })
  .describe('a process stream');

const airHumiditySchema = z
  .object({
    form: z.enum(['dew-point', 'relative-humidity']).describe('how the basis states the humidity'),
    temperature_K: num('T: the dew point, or the temperature at which the relative humidity is stated'),
    relativeHumidity: nullableNum('φ as stated, a fraction; null for a dew point (the air saturated there, φ = 1)'),
    saturationPressure_Pa: num('p_sat(T), IAPWS-IF97 region 4 (IAPWS R7-97, eq. 30)'),
    pressure_Pa: num('p, the pressure the humidity is converted at'),
    pressureOf: z.enum(['air-electrode', 'ambient']).describe('which pressure p is: the air-electrode pressure (a dew point, of the air fed) or the ambient pressure (a relative humidity, of the ambient air; conditions.ambient-pressure)'),
    waterFraction: num("x_H2O = φ p_sat(T)/p (Dalton's law for an ideal gas), kept when the air is compressed; the dry-air fractions are scaled by 1 − x_H2O"),
  })
  .nullable()
  .describe('the humidity of an air-electrode feed of humid air, as stated and as converted to its water mole fraction; null for any other feed');

const pathPointSchema = z.object({
  utilization: num('fraction of the charge basis carried by the ions from the inlet'),
  nernst_V: num('local Nernst voltage'),
  areaFraction: num('share of the active area from the inlet to this point (uniform-voltage cell)'),
  currentDensity_A_per_m2: num('local current density at the terminals, (t_ion E − ΔV_x − V)/ASR (power) or (V − t_ion E)/ASR (electrolysis)'),
  carbonActivity: num('carbon activity of the fuel-electrode gas relative to graphite'),
  fuelSide: fractions,
  airSide: fractions,
  fuelCouple_bar: z
    .record(z.string(), z.number())
    .nullable()
    .describe("partial pressures (bar) of the gases of the ion's couple (O2; and CO2 for carbonate) in the equilibrated fuel gas, from its element potentials; null where the Nernst voltage is not taken from the couple"),
});

const caseSchema = z.object({
  base: num('the design point evaluated at the resolution of the study'),
  low: nullableNum('the low case; null where it cannot be evaluated (see note)'),
  high: nullableNum('the high case; null where it cannot be evaluated (see note)'),
});

const sensitivitySchema = z.object({
  input: z.string().describe('the input perturbed'),
  path: z.string().describe('its field in the basis'),
  step: z.string().describe('the perturbation, as stated'),
  low: z.string().describe('the input value of the low case'),
  high: z.string().describe('the input value of the high case'),
  meanNernst_V: caseSchema,
  cellVoltage_V: caseSchema.describe('the cell voltage solved with the cell count and the area-specific resistance held (the resistance following its Arrhenius law where the basis gives one)'),
  efficiency: caseSchema.describe('power mode: net electrical efficiency (LHV); electrolysis: efficiency on the LHV of hydrogen'),
  stackHeat_W: caseSchema,
  note: z.string().nullable().describe('why a case could not be evaluated'),
});

const plantStreamSchema = streamSchema
  .extend({ number: z.number().int().describe('the stream number of the block flow diagram and the heat-and-material balance') })
  .describe('a numbered stream of the plant (the heat-and-material balance)');

const dutySchema = z.object({
  id: z.string(),
  name: z.string(),
  duty_W: num('heat given to the stream (negative: heat the stream gives up)'),
  from_K: num('temperature the stream enters at'),
  to_K: num('temperature the stream leaves at'),
});

const electricalSchema = z
  .object({
    cellsPerStack: z.number().int(),
    stacksInSeries: z.number().int(),
    stringsInParallel: z.number().int(),
    stackCount: z.number().int(),
    requiredCells: z.number().int().describe('cells the sizing calculation needs at the design current density (the top-level headline.cells)'),
    installedCells: z.number().int().describe('stacks × cells per stack, at least the cells required; the sizing calculation (the top level) is evaluated on the cells required; the bus, the sizing case among the cases and every other case on the cells installed'),
    stacksInSeriesFrom: z.enum(['given', 'bus-voltage-window']),
    stringsInParallelFrom: z.enum(['given', 'required-cells']),
    currentDensity_A_per_m2: num('current density of the installed cells at the load of the point the bus carries: the sizing case on the installed cells (top level), or the case'),
    cellVoltage_V: num('cell voltage of the installed cells at that point'),
    cellCurrent_A: num('current of one cell at that point: current density × active area'),
    stackVoltage_V: num('terminal voltage of one stack: cells per stack × cell voltage'),
    stackCurrent_A: num('current through one stack: one cell\'s current'),
    stackPower_W: num('power of one stack'),
    stringVoltage_V: num('voltage of one string: stacks in series × stack voltage'),
    stringCurrent_A: num('current of one string: one cell\'s current'),
    busVoltage_V: num('DC bus voltage: the string voltage'),
    busCurrent_A: num('DC bus current: strings × string current'),
    dcPower_W: num('bus voltage × bus current: every installed cell at that point'),
    conversionEfficiency: num('inverter (power) or rectifier (electrolysis) efficiency'),
    acPower_W: num('AC power of the installed array: delivered η P_DC (power) or drawn P_DC/η (electrolysis)'),
    conversionLoss_W: num('power lost in the conversion'),
  })
  .describe('how the cells are connected and the voltage and current of each level (lib/flowsheet/electrical-layout.ts)');

const powerPlantSchema = z
  .object({
    mixingTemperature_K: num('temperature the fuel, steam and any recycle are mixed and heated to: the pre-reformer inlet, else the fuel-electrode inlet'),
    steam: z
      .object({
        water_mol_per_s: num('feed water raised to steam'),
        water_kg_per_h: num('feed water raised to steam'),
        saturationTemperature_K: num('saturation temperature at the fuel-electrode pressure (IAPWS-IF97 region 4)'),
        latentHeat_J_per_mol: num('h°(H2O, gas) − h°(H2O, liquid) at the saturation temperature, species data'),
        liquidHeating_W: num('feed water heated to saturation'),
        evaporation_W: num('feed water evaporated at saturation'),
        superheating_W: num('steam heated from saturation to the mixing temperature'),
        duty_W: num('the steam raising duty: liquid heating + evaporation + superheating'),
      })
      .nullable()
      .describe('steam raising; null without steam addition'),
    duties: z.array(dutySchema).describe('every heater and reactor of the fuel and air preparation'),
    netDuty_W: num('Σ of the duties'),
    blower: z
      .object({
        inletPressure_bar: num('blower inlet pressure'),
        outletPressure_bar: num('blower outlet pressure: the air-electrode pressure'),
        inletTemperature_K: num('air supply temperature'),
        outletTemperature_K: num('air temperature after the blower'),
        flow_mol_per_s: num('air through the blower: the stack air and any fresh oxidiser air'),
        isentropicEfficiency: num('isentropic efficiency of the stage'),
        power_W: num('power given to the air (one adiabatic stage, species data)'),
        parasiticAllowance_W: num('parasitic load × stack DC power: the allowance the blower is part of'),
      })
      .nullable(),
    stackHeat_W: num('heat the stack releases with its inlets as fed (heat.asFedHeat_W)'),
    stackHeatTo: z.enum(['air-electrode exhaust', 'recovered', 'rejected']).describe('where the stack heat goes'),
    airExhaustTemperature_K: num('air-electrode exhaust temperature: carrying the stack heat (air-cooled cells) or at the stack temperature'),
    oxidiser: z
      .object({
        oxidant: z.enum(['air-electrode-exhaust', 'fresh-air']),
        airRatio: nullableNum('fresh air: O2 fed per O2 complete combustion needs'),
        freshAir_mol_per_s: nullableNum('fresh air fed to the oxidiser'),
        outletTemperature_K: num('adiabatic outlet temperature, products at chemical equilibrium (Gibbs minimum at fixed H and p)'),
        materialLimit_K: num('the material limit of the basis'),
        pressure_bar: num('pressure of the oxidiser'),
        moleFractions: fractions.describe('mole fractions of the products'),
        carbonMonoxide_ppm: num('CO left in the products, ppm by mole (wet)'),
        heatReleased_W: num('heat of the combustion that takes place, at 25 °C: H(reactants) − H(products)'),
        energyBalanceError: num('relative energy balance error of the adiabatic solve'),
      })
      .nullable(),
    cathodeLoop: z
      .object({
        burnerAir_mol_per_s: num('A: burner air, from the mole balance of the loop'),
        burnerAir_kg_per_h: num('the burner air as mass'),
        recycledShare: num('r: the share of the air-electrode exhaust returned to the air-electrode inlet'),
        inletOxygenFraction: num('the O2 mole fraction at the air-electrode inlet, from the basis'),
        airUtilization: num('O2 the cells take over the O2 entering (from the basis; the loop meets it)'),
        carbonDioxideUtilization: num('CO2 the cells take over the CO2 entering'),
        oxygenDemand_mol_per_s: num('D: O2 that complete combustion of the off-gas takes from the burner air'),
        burntProducts_mol_per_s: num('N_B: moles of the off-gas burnt completely (CO2, H2O, N2 and the noble gases), O2 not counted'),
        taken_mol_per_s: num('c_t: O2 and CO2 the cells take from the cathode gas (I/4F + I/2F)'),
        oxygenTaken_mol_per_s: num('c_O2: O2 the cells take (I/4F)'),
        burnerOutletTemperature_K: num('adiabatic outlet of the burner, the off-gas burnt completely'),
        recycleTemperature_K: num('the recycle, at the air-electrode exhaust temperature'),
        mixingTemperature_K: num('adiabatic mixing of the burner outlet with the recycle'),
        inletTemperature_K: num('air-electrode inlet temperature, from the basis'),
        heating_W: num("the loop's heater (negative: cooler) from the mixing temperature to the inlet temperature"),
        inletMoleFractions: fractions.describe('the computed air-electrode inlet'),
      })
      .nullable()
      .describe("a carbonate cell's cathode-gas loop: the off-gas burnt with burner air, mixed with a recycled share of the exhaust; null without one"),
    heatRecovery: z
      .object({
        inletTemperature_K: num('exhaust temperature entering the heat recovery'),
        exitTemperature_K: num('exhaust exit temperature, from the basis'),
        dewPoint_K: nullableNum('dew point of the exhaust (IAPWS-IF97)'),
        heatWithoutCondensation_W: num('exhaust cooled to the exit temperature, water left as vapour'),
        heatWithCondensation_W: num('the same with the water condensed to saturation at the exit'),
        latentHeat_W: num('latent heat of the condensate'),
        condensate_kg_per_h: num('water condensed'),
        deliveredHeat_W: num('recovered heat less the net duty of the plant heaters and the heat lost to ambient (plus a coolant-cooled stack\'s heat when recovered)'),
      })
      .nullable(),
    heatLoss_W: num('heat lost to ambient: plant.heat-loss × fuel LHV input (counted where there is heat recovery)'),
    chp: z
      .object({
        netPower_W: num('net AC power'),
        deliveredHeat_W: num('heat delivered'),
        electricalEfficiencyLhv: num('net power / fuel LHV input'),
        thermalEfficiencyLhv: num('heat delivered / fuel LHV input'),
        totalEfficiencyLhv: num('(net power + heat delivered) / fuel LHV input'),
        totalEfficiencyHhv: num('(net power + heat delivered) / fuel HHV input'),
        powerToHeat: nullableNum('net power / heat delivered; null when no heat is delivered'),
      })
      .nullable()
      .describe('combined heat and power figures; null without heat recovery'),
    energyBalance: z.object({
      in_W: num('Σ of the enthalpy flows and work entering the plant'),
      out_W: num('Σ of the enthalpy flows, electricity and heat leaving the plant'),
      residual: num('(in − out) / fuel LHV input: the first law over the plant, to close below 1e-9'),
      terms: z.array(z.object({ name: z.string(), value_W: z.number(), side: z.enum(['in', 'out']) })).describe('absolute enthalpy flows (heats of formation included), work, electricity and heat'),
    }),
  })
  .describe('power mode: the plant around the stack (lib/plant/plant-balance.ts)');

const electrolysisPlantSchema = z
  .object({
    feedWater_mol_per_s: num('liquid feed water taken in at its supply temperature: the steam raised and the water loop\'s make-up'),
    feedWater_kg_per_h: num('the same, kg/h'),
    steam: z
      .array(
        z.object({
          electrode: z.enum(['fuel', 'air']).describe('the electrode the steam is fed to'),
          water_mol_per_s: num('feed water raised to steam'),
          saturationTemperature_K: num("saturation temperature at the electrode's pressure (IAPWS-IF97 region 4)"),
          latentHeat_J_per_mol: num('h°(H2O, gas) − h°(H2O, liquid) at the saturation temperature, species data'),
          liquidHeating_W: num('feed water heated to saturation'),
          evaporation_W: num('feed water evaporated at saturation'),
          superheating_W: num("steam heated from saturation to the electrode's inlet temperature"),
          to_K: num("the electrode's inlet temperature"),
        }),
      )
      .describe('steam raised from the feed water, per electrode fed with vapour; empty for a liquid-fed cell'),
    waterLoop: z
      .object({
        makeUp_mol_per_s: num('water made up: the water split and the vapour the product gases carry off'),
        return_mol_per_s: num('liquid water returned from the stack outlets to its inlet'),
        drain_mol_per_s: num('liquid water leaving the stack beyond what its inlet takes (drained)'),
      })
      .nullable()
      .describe('a liquid-fed cell\'s water loop; null where the water is fed as steam'),
    duties: z.array(dutySchema).describe('every heater and cooler of the feed preparation, the product cooling and the compression'),
    feedHeat_W: num('Σ of the positive duties: the heat the feed heaters and the evaporator take'),
    coolers_W: num('Σ of the negative duties, as a positive number: the heat the coolers remove'),
    stackHeat_W: num('heat the stack releases with its inlets as fed (negative: it absorbs heat, below thermoneutral)'),
    heatLoss_W: num("heat lost to ambient from the stacks, separators and piping: plant.heat-loss × the stack's DC input (the rectifier's loss is dissipated in its own room)"),
    stackHeatSupplied_W: num('heat supplied to the stack: its demand below thermoneutral and the losses, less what a water loop\'s cooler need not remove'),
    stackHeatRemoved_W: num("stack heat left for the stack's own cooling after the losses"),
    heatSupply: z.enum(['electric', 'external']).describe('plant.heat-supply: electric heaters (counted in the electricity) or heat from outside'),
    heatSupplied_W: num('feed heat + stack heat supplied'),
    recuperator: z
      .object({
        minimumApproach_K: num('least temperature difference allowed between the two sides, plant.recuperator.minimum-approach'),
        duty_W: num("heat the stack's hot outlets give the feeds: the feed water from its supply temperature (liquid heating, evaporation, superheating) and the gases"),
        hotInlet_K: num('the stack temperature, at which the outlets enter'),
        hotOutlet_K: num('the temperature the hydrogen product and the oxygen side leave at'),
        coldOutlet_K: num('the temperature the feeds leave at (each at most its stack inlet temperature): below, at or above the saturation temperature of the feed water, which leaves it liquid, partly evaporated or superheated'),
        smallestApproach_K: num('the least temperature difference found over the exchanger (at or above the minimum approach)'),
        limitedBy: z.enum(['minimum-approach', 'feeds-at-target', 'dew-point']).describe("what bounds the duty: the minimum approach (a pinch), every feed at its stack inlet temperature, or the hot side's dew point"),
        hotDewPoint_K: nullableNum("the highest dew point of the hot outlets (no water condenses in the recuperator); null without water vapour"),
        feeds: z
          .array(
            z.object({
              id: z.string().describe('fuel-steam or air-steam (the feed water raised to that electrode\'s steam), fuel-gas or air-gas'),
              name: z.string(),
              from_K: num('the feed as it enters: the feed water (liquid) or a gas at its supply temperature'),
              to_K: num('the feed as it leaves the recuperator'),
              vapourFraction: nullableNum('the fraction of the feed water evaporated as it leaves (0 liquid, 1 vapour; between at its saturation temperature); null for a gas'),
              target_K: num("the electrode's inlet temperature, which its heaters then bring it to (the feed water: the water heater, evaporator and superheater, each from where the recuperator leaves it)"),
              duty_W: num('heat this feed takes in the recuperator'),
            }),
          )
          .describe('the feeds heated'),
      })
      .nullable()
      .describe('the feed recuperator (counter-flow, composite curves; lib/plant/recuperator.ts); null without plant.recuperator'),
    productCooling: z
      .object({
        from_K: num('the temperature the product comes at: the stack temperature, or after the recuperator'),
        to_K: num('the compressor inlet temperature'),
        pressure_bar: num('the fuel-electrode pressure'),
        duty_W: num('heat given to the product (negative: removed), condensation included'),
        condensed_mol_per_s: num('water condensed to saturation at the compressor inlet temperature'),
        dried_mol_per_s: num('water vapour left, removed by the dryer'),
      })
      .nullable()
      .describe('the product cooled and dried ahead of the compressor; null without hydrogen compression'),
    compression: z
      .object({
        inletPressure_bar: num('the fuel-electrode pressure'),
        deliveryPressure_bar: num('the delivery pressure of the basis'),
        inletTemperature_K: num('compressor inlet temperature'),
        intercoolTemperature_K: num('temperature after each intercooler and the after-cooler'),
        stages: num('intercooled stages'),
        stagesFrom: z
          .enum(['given', 'maximum-stage-ratio', 'maximum-discharge-temperature'])
          .describe('the stages as given, or the fewest that keep each stage at or below the maximum stage ratio and the maximum discharge temperature of the basis, named by the rule that set their number'),
        pressureRatioPerStage: num('(p_delivery/p_inlet)^(1/N), equal in every stage'),
        isentropicEfficiency: num('isentropic efficiency of each stage'),
        flow_mol_per_s: num('dry product gas compressed'),
        stageOutletTemperatures_K: z.array(z.number()).describe('outlet temperature of each stage'),
        dischargeLimit_K: num('the discharge temperature the stages are held at (stages from a rule) or checked against: the basis\'s maximum, or where it states none the reference\'s for the gas'),
        dischargeLimitSource: z.string().describe('whose limit it is: "the basis", or the standard and service it is taken from'),
        power_W: num('power given to the gas, Σ over the stages (ideal gas, species data; mechanical and drive losses not included)'),
        work_J_per_kg: num('work per kg of gas compressed'),
        intercoolers_W: num('heat removed between the stages'),
        aftercooler_W: num('heat removed after the last stage'),
      })
      .nullable()
      .describe('hydrogen compression; null without plant.hydrogen-compression'),
    specificEnergy: z.object({
      hydrogen_kg_per_h: num('net hydrogen made'),
      stackDc_W: num('stack DC power'),
      conversionLoss_W: num('rectifier loss: P_DC (1/η − 1)'),
      parasitic_W: num('balance-of-plant load: parasitic share × P_DC'),
      electricHeat_W: num('heat supplied by electric heaters (0 where it comes from outside)'),
      compressor_W: num('hydrogen compressor power'),
      totalElectric_W: num('Σ: the electricity the plant takes'),
      stack_kWh_per_kg: num('stack DC power per kg of hydrogen'),
      system_kWh_per_kg: num('all the electricity per kg of hydrogen'),
      systemEfficiencyLhv: num('LHV of the combustibles made / (electricity + heat from outside)'),
      systemEfficiencyHhv: num('HHV of the combustibles made / (electricity + heat from outside)'),
    }),
    energyBalance: z.object({
      in_W: num('Σ of the enthalpy flows, electricity and heat entering the plant'),
      out_W: num('Σ of the enthalpy flows and heat leaving the plant'),
      residual: num('(in − out) / the electricity: the first law over the plant, to close below 1e-9'),
      terms: z.array(z.object({ name: z.string(), value_W: z.number(), side: z.enum(['in', 'out']) })).describe('absolute enthalpy flows (heats of formation included), work, electricity and heat'),
    }),
  })
  .describe('electrolysis: the plant around the stack (lib/plant/plant-balance.ts)');

const plantSchema = z
  .object({
    electrical: electricalSchema,
    streams: z.array(plantStreamSchema).describe('the numbered streams of the heat-and-material balance'),
    power: powerPlantSchema.nullable().describe('power mode; null in electrolysis'),
    electrolysis: electrolysisPlantSchema.nullable().describe('electrolysis; null in power mode'),
  })
  .describe('the plant around the stack (the plant section of the basis, issue 18)');

/** The results of the design point (the sizing case); resultsSchema adds the sections of issue 19 below. */
const designResultsSchema = z
  .object({
    format: z.literal('cellbasis-results/1'),
    tool: z.object({ name: z.literal('cellbasis'), version: z.string() }),
    speciesData_sha256: z.string().describe('SHA-256 of the species data file the numbers come from'),
    project: z.object({ id: z.string(), title: z.string(), number: z.string() }).describe('the project and document; its revision and status are the archive\'s (projects/<id>/issued/)'),
    technology: z.object({
      id: z.string(),
      name: z.string(),
      mode: z.enum(MODES),
      ion: z.enum(IONS),
      waterPhase: z.enum(['gas', 'liquid']),
      fuelGasEquilibrium: z.boolean().describe('the fuel gas is re-equilibrated along the cell (reforming and shift at the electrode)'),
    }),
    conditions: z.object({
      temperature_K: num('stack operating temperature'),
      fuelPressure_bar: num('absolute pressure at the fuel electrode'),
      airPressure_bar: num('absolute pressure at the air electrode'),
      fuelInletTemperature_K: num('fuel-electrode feed at the stack inlet'),
      airInletTemperature_K: num('air-electrode feed at the stack inlet'),
      ambientTemperature_K: num('cold sink of the Carnot comparison'),
      airHumidity: airHumiditySchema,
    }),
    headline: z
      .object({
        meanNernst_V: num('charge-mean Nernst voltage (1/U)∫E du along the fuel path: the Gibbs energy per charge, an indicator; the cell voltage follows from the uniform-voltage cell (electrochemistry.areaMeanNernst_V)'),
        inletNernst_V: num('Nernst voltage at the inlet: of the inlet gas, its limit u → 0⁺, or at the first equilibrated increment where it is unbounded (fuelPath.inlet)'),
        outletNernst_V: num('Nernst voltage at the outlet'),
        openCircuit_V: num('open-circuit voltage at the inlet: t_ion E_in − crossover allowance (power), t_ion E_in (electrolysis)'),
        cellVoltage_V: num('operating cell voltage'),
        stackVoltage_V: num('cells × cell voltage: the voltage were every cell in one series string, not a terminal voltage of this design (plant.electrical gives the stack, string and bus voltages)'),
        cells: z.number().int().describe('number of cells'),
        cellCurrent_A: num('current of one cell, j × A'),
        totalCurrent_A: num('Σ of the cell currents at the terminals, not the current of any one conductor (plant.electrical gives the stack and bus currents) (the ionic current, electrochemistry.ionicCurrent_A, sets the flows)'),
        stackPower_W: num('stack DC power: output (power mode) or input (electrolysis)'),
        netPower_W: num('power mode: net output after the balance-of-plant load; electrolysis: stack input'),
        electricalEfficiencyLhv: nullableNum('power mode: net electric power over fuel LHV input'),
        electricalEfficiencyHhv: nullableNum('power mode: net electric power over fuel HHV input'),
        thermodynamicLimitLhv: nullableNum('power mode: −ΔG(T) of the fuel oxidation over its LHV'),
        thermodynamicLimitHhv: nullableNum('power mode: −ΔG(T) of the fuel oxidation over its HHV'),
        stackHeat_W: num('isothermal stack heat: released with every inlet and outlet at the stack temperature (negative: heat needed)'),
        maxLocalCurrentDensity_A_per_m2: num('highest local current density at the terminals along the cell (at the inlet, or at the first equilibrated increment of an unbounded inlet)'),
        airFlow_kg_per_h: nullableNum('air-electrode feed'),
        hydrogenProduction_kg_per_h: nullableNum('electrolysis: hydrogen produced'),
        hydrogenProduction_kg_per_day: nullableNum('electrolysis: hydrogen produced'),
        specificEnergy_kWh_per_kg: nullableNum('electrolysis: electric energy per kg of hydrogen'),
        minimumSteamToCarbon: nullableNum('least S/C keeping the equilibrated fuel gas free of carbon (the higher of stack and pre-reformer temperature); null without carbon'),
        carbonMargin: nullableNum('design S/C minus the minimum; null without carbon or steam'),
        maxCarbonActivity: nullableNum('highest carbon activity on the fuel path in the stack, at the stack temperature (the pre-reformer outlet not included); null without carbon'),
      })
      .describe('the headline numbers a review looks at first'),
    electrochemistry: z.object({
      standardVoltage_V: num('E° of H2 + ½O2 → H2O at T (water as the cell forms it)'),
      reversibleVoltage_V: num('−ΔG°/2F of the hydrogen reaction at T'),
      thermoneutralVoltage_V: num('−ΔH°/2F of the hydrogen reaction at T'),
      effectiveThermoneutralVoltage_V: num('(H_in − H_out)/I_ion of the actual gases (power mode), (H_out − H_in)/I_ion (electrolysis)'),
      effectiveNernst_V: num('area-mean driving voltage: t_ion Ē_A − crossover allowance (power mode); t_ion Ē_A (electrolysis); V = it ∓ j·ASR'),
      areaMeanNernst_V: num('area-mean Nernst voltage Ē_A = ∫E dA/A of the uniform-voltage cell'),
      harmonicIntegral_per_V: num('∫₀^U du/y(u), y the local ionic driving voltage t_ion E − ΔV_x − t_ion V (power) or t_ion (V − E) (electrolysis); U/∫ = j ASR + (1 − t_ion) V (power) or j ASR − (1 − t_ion) V (electrolysis); with an activation loss y = i(u) ASR, the local ohmic loss, and U/∫ = j ASR'),
      ionicCurrent_A: num('Σ of the ionic currents of the cells: the charge rate that sets the flows by Faraday\'s law'),
      ionicCurrentDensity_A_per_m2: num('mean ionic current density: j + leakage (power), j − leakage (electrolysis)'),
      leakageCurrentDensity_A_per_m2: num('electronic leakage through a mixed conductor, (1 − t_ion) V/ASR'),
      areaSpecificResistance_ohm_m2: num('resistance used, or implied by a given voltage through the uniform-voltage cell: |Ē_eff − V| / j'),
      voltageSource: z.enum(['given', 'area-specific-resistance']),
      ionicTransferenceNumber: num('t_ion'),
      crossoverAllowance_V: num('voltage allowance for crossover and leakage'),
      resistanceLaw: z
        .object({
          activationEnergy_J_per_mol: num('E_a of ASR(T) = ASR_ref exp[(E_a/R)(1/T − 1/T_ref)]'),
          referenceTemperature_K: num('T_ref: where the given resistance applies (the operating temperature unless the basis names another)'),
          source: z.string().describe('where the activation energy comes from, as the basis states it'),
        })
        .nullable()
        .describe('the Arrhenius law of the resistance; null: the resistance is held constant where the temperature changes (sweep and sensitivity)'),
      activationLoss: z
        .object({
          tafelSlope_V_per_decade: num('b of η_act(i) = (b/ln 10) asinh(i/(2 i₀)), the symmetric Butler–Volmer loss'),
          exchangeCurrentDensity_A_per_m2: num('i₀, referred to the geometric (active) area'),
          source: z.string().describe('where b and i₀ come from, as the basis states it'),
          atMeanCurrentDensity_V: num('η_act(j) at the mean current density'),
          areaMean_V: num('area-mean activation loss η̄_A = ∫η_act(i) dA / A over the cell: V = Ē_A − ΔV_x − η̄_A − j ASR (power), Ē_A + η̄_A + j ASR (electrolysis)'),
          ohmic_V: num('ohmic loss j ASR'),
        })
        .optional()
        .describe('the activation loss of the electrodes and the loss breakdown of the point; absent: the basis gives none (the ohmic cell)'),
      chargeBasis_A: num('charge of complete reaction of the feed (U = 1) on the stack scale'),
      utilization: num('fuel utilization (power) or steam conversion (electrolysis)'),
      elementBalanceError: num('largest relative element-balance error of the equilibria along the fuel path'),
    }),
    operatingPoint: z.object({
      currentDensity_A_per_m2: num('current density'),
      activeArea_m2: num('active area per cell'),
      totalActiveArea_m2: num('cells × active area'),
      cellsFrom: z.enum(['cells', 'power', 'hydrogen']).describe('what set the cell count'),
      parasiticFraction: num('balance-of-plant share of the gross DC output (power mode)'),
      conversionEfficiency: num('η of the power conversion: inverter (power mode, P_AC = η P_DC) or rectifier (electrolysis, P_AC = P_DC / η)'),
      airUtilization: nullableNum('O2 consumed / O2 fed (power mode)'),
      airRatio: nullableNum('O2 fed / O2 consumed (power mode)'),
      oxygenConsumed_mol_per_s: nullableNum('power mode: I/4F'),
      netWaterProduced_mol_per_s: num('water leaving the stack minus water entering it (negative: consumed)'),
    }),
    streams: z.array(streamSchema),
    efficiency: z.object({
      fuelLhvInput_W: nullableNum('power mode: fuel flow × LHV (25 °C)'),
      fuelHhvInput_W: nullableNum('power mode: fuel flow × HHV (25 °C)'),
      thermodynamicLimitLhv: nullableNum('power mode'),
      thermodynamicLimitHhv: nullableNum('power mode'),
      carnotLimit: nullableNum('1 − T_ambient/T_stack, for comparison (power mode)'),
      voltageEfficiency: num('V/Ē (power) or Ē/V (electrolysis), Ē the charge-mean Nernst voltage'),
      faradaicEfficiency: num('I/I_ion (power) or I_ion/I (electrolysis): the share of the current the ions carry; 1 for a pure ionic conductor'),
      electricalEfficiencyLhvGross: nullableNum('stack DC power over LHV input'),
      electricalEfficiencyHhvGross: nullableNum('stack DC power over HHV input'),
      electricalEfficiencyLhvNet: nullableNum('net power over LHV input'),
      electricalEfficiencyHhvNet: nullableNum('net power over HHV input'),
      electrolysisEfficiencyLhv: nullableNum('electricity only: LHV of the products (H2; with CO and CH4 in co-electrolysis) over the electric power in'),
      electrolysisEfficiencyHhv: nullableNum('electricity only: HHV of the products over the electric power in (above 1 for a steam feed, whose latent heat comes with the steam)'),
      specificEnergy_kWh_per_kg: nullableNum('electrolysis: electric energy per kg of hydrogen (electricity only)'),
      hydrogenProduction_mol_per_s: nullableNum('electrolysis'),
      oxygenProduction_mol_per_s: nullableNum('electrolysis'),
      carbonMonoxideProduction_mol_per_s: nullableNum('co-electrolysis'),
      methaneProduction_mol_per_s: nullableNum('co-electrolysis: methane formed in the equilibrated outlet, net of the feed'),
      productLhv_W: nullableNum('electrolysis: LHV of the combustibles made, net of the feed (H2, CO, CH4)'),
      productHhv_W: nullableNum('electrolysis: the same on HHV'),
      steamLatentHeat_W: nullableNum('electrolysis: latent heat at 25 °C of the water consumed as vapour, which a steam feed brings from outside'),
      heatInclusiveEfficiencyLhv: nullableNum('electrolysis: product LHV over electricity plus the heat the stack absorbs'),
      heatInclusiveEfficiencyHhv: nullableNum('electrolysis: product HHV over electricity, the heat the stack absorbs and the latent heat of the steam consumed'),
    }),
    heat: z.object({
      isothermalHeat_W: num('Σ_in ṅh(T) − Σ_out ṅh(T) + W_in, every stream at the stack temperature'),
      asFedHeat_W: num('the same with the inlets at their own temperatures'),
      inletEnthalpyIsothermal_W: num('Σ_in ṅ h at the stack temperature'),
      inletEnthalpyAsFed_W: num('Σ_in ṅ h at the inlet temperatures'),
      outletEnthalpy_W: num('Σ_out ṅ h'),
      electricWorkIn_W: num('−P (power mode), +P (electrolysis)'),
      heatPerCell_W: num('isothermal heat per cell'),
      heatPerArea_W_per_m2: num('isothermal heat per unit active area'),
      stackBalance: z
        .object({
          fuelHeating_W: num('heat that brings the fuel-electrode feed from its inlet temperature to the stack temperature'),
          airHeating_W: num('heat that brings the air-electrode feed from its inlet temperature to the stack temperature; asFedHeat_W = isothermalHeat_W − fuelHeating_W − airHeating_W'),
          airExhaustTemperature_K: num('the air-electrode exhaust carrying asFedHeat_W: at the stack temperature where the balance closes'),
          closingAirInletTemperature_K: nullableNum('the air-electrode inlet temperature at which the air fed closes the balance (asFedHeat_W = 0); null where none in the species data\'s range does'),
        })
        .nullable()
        .describe('power mode, air-cooled cells (solid oxide, proton ceramic, molten carbonate): the stack heat balance with the feeds at their inlet temperatures'),
      coolingAir_mol_per_s: nullableNum('power mode, air-cooled cells: the air of the feed composition that, fed at the air-electrode inlet temperature and leaving at the stack temperature, carries the isothermal heat less the fuel feed\'s heating (closes the stack balance); null where no air flow does (the air entering on the wrong side of the stack temperature for the heat to carry)'),
      coolingAir_kg_per_h: nullableNum('the same, kg/h'),
      coolingAirRatio: nullableNum('cooling air over the air that the O2 consumed needs (λ for cooling)'),
      coolingWater_kg_per_h: nullableNum('electrolysis fed liquid water: the water that carries the isothermal heat at the allowed rise (the water loop)'),
      allowedAirTemperatureRise_K: num('allowed air temperature rise through the stack'),
      hydrogenCrossCheck_W: nullableNum('pure-hydrogen fuel: I (−ΔH(T)/2F − V), equal to the isothermal heat'),
      heatDemand_W: nullableNum('electrolysis below thermoneutral: heat to supply (positive)'),
      liquidWaterOut_mol_per_s: nullableNum('liquid-water cells: liquid water leaving'),
      outletsSaturated: z.boolean().nullable().describe('liquid-water cells: whether both outlet gases can be saturated'),
    }),
    carbon: z.object({
      steamToCarbon: nullableNum('design S/C'),
      minimumSteamToCarbonStack: nullableNum('at the stack temperature and fuel pressure'),
      minimumSteamToCarbonPreReformer: nullableNum('at the pre-reformer temperature'),
      preReformerCarbonActivity: nullableNum('carbon activity of the pre-reformer outlet'),
      inletCarbonActivity: nullableNum('carbon activity of the fuel gas at the stack inlet (equilibrated)'),
      maxCarbonActivity: nullableNum('along the fuel path'),
    }),
    fuelPath: z.object({
      points: z.array(pathPointSchema),
      inlet: z.enum(['feed', 'limit', 'first-increment']).describe('how the inlet Nernst voltage is found: the inlet gas; the limit u → 0⁺ where an electrode has no feed; the first equilibrated increment, where the path starts, where it is unbounded (no product at the inlet)'),
      inletUtilization: num('utilization at which the inlet Nernst voltage is evaluated (0, or the first increment)'),
      nernstForm: z
        .enum(['quotient', 'oxygen-potential'])
        .describe("the form of the Nernst equation a reader evaluates E with: the pressure quotient of the electrode reactions, or the potentials of the ion's couple across the electrolyte where the fuel gas holds no hydrogen (both give the same E where both apply)"),
      standardVoltage_V: num('E° used by the Nernst equation (an alkaline cell: with −RT/2F ln a_w of its electrolyte water)'),
      waterActivity: num('activity of the liquid water of a liquid-water cell (KOH solution by Balej 1985 for an alkaline cell), 1 otherwise'),
    }),
    sweeps: z.object({
      temperature: z.array(
        z.object({
          temperature_K: num('temperature'),
          reversibleVoltage_V: num('−ΔG°/2F of the hydrogen reaction'),
          thermoneutralVoltage_V: num('−ΔH°/2F of the hydrogen reaction'),
          fuelReversibleVoltage_V: nullableNum('−ΔG°/zF of the actual fuel (power mode)'),
          limitLhv: nullableNum('−ΔG(T)/LHV of the actual fuel (power mode)'),
          limitHhv: nullableNum('−ΔG(T)/HHV of the actual fuel (power mode)'),
          hydrogenLimitHhv: num('−ΔG(T)/HHV of hydrogen (the textbook curve of a fuel cell)'),
          electrolysisLimitLhv: nullableNum('LHV/ΔG(T) of hydrogen, ΔG of splitting water: the efficiency over electricity alone of a reversible electrolyser (electrolysis mode)'),
          electrolysisLimitHhv: nullableNum('HHV/ΔG(T) of hydrogen, ΔG of splitting water: the efficiency over electricity alone of a reversible electrolyser (electrolysis mode)'),
          carnot: num('1 − T_ambient/T'),
        }),
      ),
      currentDensity: z.array(
        z.object({
          currentDensity_A_per_m2: num('current density'),
          cellVoltage_V: num('the uniform-voltage cell at this current density, the resistance and utilization held'),
          stackPower_W: num('stack DC power'),
          stackHeat_W: num('isothermal stack heat, I (V_tn,eff − V) or I (V − V_tn,eff)'),
        }),
      ),
      stackTemperature: z
        .array(
          z.object({
            temperature_K: num('stack temperature'),
            areaSpecificResistance_ohm_m2: num('the resistance at this temperature: its Arrhenius law, or held at the design value without one'),
            cellVoltage_V: num('the uniform-voltage cell at this temperature, current density, utilization and cell count held'),
            efficiency: num('power mode: net electrical efficiency (LHV); electrolysis: efficiency on the LHV of hydrogen'),
            stackHeat_W: num('isothermal stack heat'),
          }),
        )
        .describe('the design point at other stack temperatures (coarse fuel path; temperatures where it cannot be evaluated are left out)'),
      steamToCarbon: z.array(
        z.object({
          steamToCarbon: num('S/C'),
          carbonActivityStack: num('carbon activity of the equilibrated fuel gas at the stack temperature'),
          carbonActivityPreReformer: nullableNum('the same at the pre-reformer temperature'),
        }),
      ),
    }),
    sensitivities: z.array(sensitivitySchema),
    plant: plantSchema,
    hazards: hazardAssessmentSchema,
    findings: z.array(findingSchema).describe('what the calculation shows a reviewer must look at, most severe first (lib/plant/findings.ts)'),
  })
  .describe('cellbasis results of one design basis');

const supplySchema = z
  .object({
    air_kg_per_h: nullableNum('the gas the plant supplies to the air electrode: air (power mode) or sweep gas (electrolysis); null where the air electrode takes liquid water or nothing'),
    fuel_kg_per_h: nullableNum('power mode: the fuel the plant supplies, as given before steam is added'),
    water_kg_per_h: nullableNum('water the plant feeds to the stack, vapour and liquid: power mode, the steam added to the fuel; electrolysis, the water fed to the water electrode (a circulating loop with it); null where none is fed'),
    waterSplit_kg_per_h: nullableNum('electrolysis: the water the stack splits, which the plant must make up'),
  })
  .describe('what the plant supplies to the stack');

const degradationSchema = z
  .object({
    of: z.enum(DEGRADED_QUANTITIES).describe('what the rate applies to'),
    rate_per_h: num('r, the fraction lost (voltage) or gained (resistance) per hour of operation'),
    operatingTime_h: num('t, hours of operation'),
    fraction: num('r t'),
    beginningOfLifeCellVoltage_V: num('V₀: the cell voltage at the same point at the beginning of life'),
    beginningOfLifeAreaSpecificResistance_ohm_m2: num('ASR₀: the resistance at the same point at the beginning of life'),
  })
  .nullable()
  .describe('degradation at an operating time: ASR = ASR₀ (1 + r t), or V = V₀ (1 ∓ r t) at the same current density (linear at a constant rate, common practice, no source); null: the beginning of life');

/** The sections every operating point has; a case carries them, each null when the case cannot run. */
const point = designResultsSchema.shape;

const caseResultSchema = z
  .object({
    id: z.string().describe('the case id, its key under cases: of the basis ("base": the base values as the sizing case)'),
    title: z.string(),
    purpose: z.string().describe('what it governs or checks'),
    sizing: z.boolean().describe('the case that fixes the hardware; its results are the top-level results'),
    load: z
      .enum(['sizing', 'current-density', 'target-power', 'target-hydrogen'])
      .describe('how the case states its load: the sizing case as any basis does; its current density; or a target met on the cells installed (the sizing case\'s layout) by solving for the current density'),
    overrides: z.array(z.object({ path: z.string(), text: z.string(), source: z.string().nullable() })).describe('the values the case changes, as written'),
    ran: z.boolean().describe('false when the case cannot run at its load on the hardware of the sizing case (a finding says why); its figures are then null'),
    resistance: z
      .object({
        from: z.enum(['sizing-case', 'case']).describe('the cells of the sizing case, or the case\'s own cell-voltage or area-specific-resistance'),
        beginningOfLife_ohm_m2: num('area-specific resistance at the beginning of life, at its reference temperature'),
        referenceTemperature_K: num('where it applies (a resistance law scales it from there)'),
      })
      .nullable(),
    conditions: point.conditions.nullable(),
    headline: point.headline.nullable(),
    electrochemistry: point.electrochemistry.nullable(),
    operatingPoint: point.operatingPoint.nullable(),
    streams: z.array(streamSchema),
    efficiency: point.efficiency.nullable(),
    heat: point.heat.nullable(),
    carbon: point.carbon.nullable(),
    supply: supplySchema.nullable(),
    degradation: degradationSchema,
    plant: plantSchema
      .nullable()
      .describe('the plant around the stack at this case, on the sizing case\'s electrical layout (cells per stack, stacks in series, strings in parallel) with the plant blocks of the basis; null where the case cannot run or its plant cannot be balanced (a finding says why)'),
    findings: z.array(findingSchema),
    curve: z
      .array(
        z.object({
          currentDensity_A_per_m2: num('current density'),
          cellVoltage_V: num('the uniform-voltage cell of the case at this current density, its utilization and resistance held'),
          efficiency: num('power mode: net electrical efficiency (LHV); electrolysis: efficiency on the LHV of hydrogen'),
        }),
      )
      .describe('the case\'s polarisation and efficiency curve, over the current densities of all cases (empty when it cannot run)'),
  })
  .describe('one operating case on the hardware of the sizing case');

const envelopeRowSchema = z
  .object({
    id: z.string().describe('the quantity\'s id in lib/plant/data/envelope.yaml'),
    quantity: z.string(),
    path: z.string().describe('where each case carries it, dotted, e.g. headline.airFlow_kg_per_h'),
    unit: z.string().describe('its unit, as its key states it'),
    governs: z.enum(['max', 'min']).describe('whether the largest or the smallest value sizes the equipment'),
    sizes: z.string().describe('what it sizes'),
    value: num('the governing value'),
    case: z.string().describe('the id of the case that sets it (on equal values, the first in order: the sizing case first)'),
    sizingValue: nullableNum('its value in the sizing case'),
  })
  .describe('one quantity of the envelope');

export const resultsSchema = designResultsSchema
  .extend({
    supply: supplySchema,
    degradation: degradationSchema,
    cases: z.array(caseResultSchema).describe('the operating cases of the basis, the sizing case among them ([] when the basis defines none)'),
    envelope: z
      .array(envelopeRowSchema)
      .describe('for each sizing quantity that applies, the governing value over the cases and the case that sets it ([] without cases)'),
  })
  .describe('cellbasis results of one design basis');

export type Results = z.infer<typeof resultsSchema>;
export type CaseResult = z.infer<typeof caseResultSchema>;
export type EnvelopeRow = z.infer<typeof envelopeRowSchema>;
export type StreamResult = z.infer<typeof streamSchema>;
