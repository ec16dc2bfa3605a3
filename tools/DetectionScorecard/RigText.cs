namespace BcPrep.Tools.Scorecard;

/// <summary>
/// The rig file of the scorecard's days: the sample stand's channels and calibrations, no pinned points and no
/// tares (the days start at rest or already running), with the <c>[steady]</c> table the scorecard is run with.
/// </summary>
public static class RigText
{
    /// <summary>The sample rig's limits, written once from the sensors as the README teaches (the baseline).</summary>
    public const string HandWrittenSteady = """
        [steady]
        block = "1 s"
        window = "5 min"
        min_duration = "8 min"
        settled_tail = "5 min"
        key = [
          { channel = "mdot", max_change = "0.0004 kg/s", max_scatter = "0.0004 kg/s", step = "0.002 kg/s", min = "0.005 kg/s" },
          { channel = "t_out", max_change = "0.3 K", max_scatter = "0.3 K", step = "2 K" },
          { channel = "t_w3", max_change = "0.4 K", max_scatter = "0.3 K", step = "3 K" },
        ]
        """;

    /// <summary>The conditioning of a 1 kHz day with mains hum: a 50 Hz notch (with harmonics) and a 0.5 Hz low-pass for detection.</summary>
    public const string Filters = """
        [conditioning]
        mains = "50 Hz"
        lowpass_cutoff = "0.5 Hz"
        """;

    public static string Build(string steadyTable) => Channels + "\n" + steadyTable + "\n";

    private const string Channels = """
        [rig]
        name = "Scorecard heated duct"
        fluid = "dry_air"

        [duct]
        inner_diameter = "52.5 mm"
        inner_diameter_uncertainty = "0.05 mm"
        wall_roughness = "1.5 um"
        heated_length = "1.20 m"
        heater_loss_fraction = "5 %"
        heater_loss_fraction_uncertainty = "2 %"

        [duct.planes]
        inlet = "0.15 m"
        outlet = "1.45 m"

        [log]
        time_column = "timestamp"
        time_format = "iso8601"

        [[channel]]
        id = "p_baro"
        column = "PBARO_V"
        measures = "barometric_pressure"
        sensor = "linear"
        raw_unit = "V"
        unit = "hPa"
        gain = 60.0
        offset = 800.0
        uncertainty = [ { kind = "certificate", expanded = "0.30 hPa", k = 2 } ]

        [[channel]]
        id = "p_in"
        column = "PT_IN_V"
        measures = "static_pressure"
        plane = "inlet"
        reference = "p_baro"
        sensor = "linear"
        raw_unit = "V"
        unit = "Pa"
        gain = 500.0
        uncertainty = [ { kind = "span", value = "0.25 %", span = "5 kPa" } ]

        [[channel]]
        id = "p_out"
        column = "PT_OUT_V"
        measures = "static_pressure"
        plane = "outlet"
        reference = "p_baro"
        sensor = "linear"
        raw_unit = "V"
        unit = "Pa"
        gain = 500.0
        uncertainty = [ { kind = "span", value = "0.25 %", span = "5 kPa" } ]

        [[channel]]
        id = "mdot"
        column = "FM_MA"
        measures = "mass_flow"
        sensor = "linear"
        raw_unit = "mA"
        unit = "kg/s"
        gain = 0.003125
        offset = -0.0125
        uncertainty = [
          { kind = "reading", value = "1.0 %" },
          { kind = "span", value = "0.1 %", span = "0.05 kg/s" },
        ]

        [[channel]]
        id = "t_cj"
        column = "RTD_CJ_OHM"
        measures = "cold_junction_temperature"
        sensor = "rtd"
        r0 = "100 ohm"
        tolerance_class = "A"
        uncertainty = [ { kind = "class", class = "A" } ]

        [[channel]]
        id = "t_in"
        column = "TC_IN_MV"
        measures = "bulk_temperature"
        plane = "inlet"
        sensor = "thermocouple"
        type = "K"
        raw_unit = "mV"
        cold_junction = "t_cj"
        uncertainty = [ { kind = "class", class = "1" } ]

        [[channel]]
        id = "t_out"
        column = "TC_OUT_MV"
        measures = "bulk_temperature"
        plane = "outlet"
        sensor = "thermocouple"
        type = "K"
        raw_unit = "mV"
        cold_junction = "t_cj"
        uncertainty = [ { kind = "class", class = "1" } ]

        [[channel]]
        id = "t_w1"
        column = "TC_W1_MV"
        measures = "wall_temperature"
        position = "0.35 m"
        sensor = "thermocouple"
        type = "K"
        raw_unit = "mV"
        cold_junction = "t_cj"
        uncertainty = [ { kind = "class", class = "1" } ]

        [[channel]]
        id = "t_w2"
        column = "TC_W2_MV"
        measures = "wall_temperature"
        position = "0.65 m"
        sensor = "thermocouple"
        type = "K"
        raw_unit = "mV"
        cold_junction = "t_cj"
        uncertainty = [ { kind = "class", class = "1" } ]

        [[channel]]
        id = "t_w3"
        column = "TC_W3_MV"
        measures = "wall_temperature"
        position = "0.95 m"
        sensor = "thermocouple"
        type = "K"
        raw_unit = "mV"
        cold_junction = "t_cj"
        uncertainty = [ { kind = "class", class = "1" } ]

        [[channel]]
        id = "t_w4"
        column = "TC_W4_MV"
        measures = "wall_temperature"
        position = "1.25 m"
        sensor = "thermocouple"
        type = "K"
        raw_unit = "mV"
        cold_junction = "t_cj"
        uncertainty = [ { kind = "class", class = "1" } ]

        [[channel]]
        id = "heater_v"
        column = "HTR_V_SIG"
        measures = "heater_voltage"
        sensor = "linear"
        raw_unit = "V"
        unit = "V"
        gain = 25.0
        uncertainty = [ { kind = "reading", value = "0.5 %" } ]

        [[channel]]
        id = "heater_i"
        column = "HTR_I_SIG"
        measures = "heater_current"
        sensor = "linear"
        raw_unit = "V"
        unit = "A"
        gain = 2.5
        uncertainty = [ { kind = "reading", value = "0.5 %" } ]
        """;
}
