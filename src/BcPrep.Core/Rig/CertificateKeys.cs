using BcPrep.Calibration;

namespace BcPrep.Rig;

/// <summary>
/// Per-sensor calibration-certificate keys of a channel. A thermocouple's <c>correction</c> table holds exactly one
/// of <c>emf</c> ("-12 uV", added to the measured emf), <c>temperature</c> ("0.3 K", added to the temperature) or
/// <c>deviation</c> (coefficients aᵢ of ΔE(t) = Σ aᵢ tⁱ, t in °C, in <c>deviation_unit</c>, default "uV"); an RTD's
/// <c>coefficients</c> table holds its own <c>a</c>, <c>b</c> and <c>c</c> (°C⁻¹, °C⁻², °C⁻⁴; c defaults to IEC
/// 60751's). Both carry the certificate's <c>expanded</c> uncertainty (emf or temperature), <c>k</c> (default 2) and
/// optionally <c>certificate</c>.
/// </summary>
internal static class CertificateKeys
{
    public static ThermocoupleCertificate? ReadThermocouple(TableReader? t)
    {
        if (t is null)
        {
            return null;
        }
        var given = new[] { "emf", "temperature", "deviation" }.Where(t.Has).ToList();
        if (given.Count != 1)
        {
            t.Report(given.Count == 0 ? "emf" : given[1], "a thermocouple correction gives exactly one of emf = \"-12 uV\", temperature = \"0.3 K\" or deviation = [a0, a1, a2] (ΔE(t) = Σ aᵢ tⁱ, t in degC)");
        }
        var kind = given.FirstOrDefault() switch
        {
            "temperature" => ThermocoupleCorrectionKind.Temperature,
            "deviation" => ThermocoupleCorrectionKind.Deviation,
            _ => ThermocoupleCorrectionKind.Emf,
        };
        double? value = 0.0;
        IReadOnlyList<double> coefficients = [];
        switch (kind)
        {
            case ThermocoupleCorrectionKind.Emf:
                value = t.Quantity("emf", Dimension.Voltage, required: given.Count == 0, minSi: -1e-3, maxSi: 1e-3);
                break;
            case ThermocoupleCorrectionKind.Temperature:
                value = t.Quantity("temperature", Dimension.TemperatureDifference, minSi: -20.0, maxSi: 20.0);
                break;
            default:
                var unitText = t.String("deviation_unit") ?? "uV";
                var scale = UnitText.TryToSi("1 " + unitText, Dimension.Voltage, out var s, out _) ? s : double.NaN;
                if (double.IsNaN(scale))
                {
                    t.Report("deviation_unit", $"'{unitText}' is not a unit of voltage (e.g. \"uV\")");
                }
                var numbers = new List<double>();
                foreach (var entry in t.Array("deviation") ?? [])
                {
                    if (entry.Value is double a)
                    {
                        numbers.Add(a * scale);
                    }
                    else
                    {
                        t.Report("deviation", $"deviation coefficients are plain numbers in deviation_unit per degC^i; {entry.Path} is not");
                    }
                }
                if (numbers.Count is 0 or > 6)
                {
                    t.Report("deviation", "a deviation function has 1 to 6 coefficients (a0 … a5)");
                }
                coefficients = numbers;
                break;
        }
        var expandedDimension = kind == ThermocoupleCorrectionKind.Temperature ? Dimension.TemperatureDifference : Dimension.Voltage;
        var expanded = t.Quantity("expanded", expandedDimension, required: true, minSi: 0.0);
        var k = t.Number("k", min: 1.0, max: 10.0) ?? 2.0;
        var certificate = t.String("certificate") ?? "certificate";
        if (kind != ThermocoupleCorrectionKind.Deviation)
        {
            t.Has("deviation_unit");
        }
        t.RejectUnknownKeys();
        return value is null || expanded is null || given.Count != 1 || coefficients.Any(double.IsNaN)
            ? null
            : new ThermocoupleCertificate(kind, value.Value, coefficients, expanded.Value, k, certificate);
    }

    public static RtdCertificate? ReadRtd(TableReader? t)
    {
        if (t is null)
        {
            return null;
        }
        var a = t.Number("a", required: true, min: 3.0e-3, max: 4.5e-3);
        var b = t.Number("b", required: true, min: -1.0e-6, max: -1.0e-7);
        var c = t.Number("c", min: -1.0e-10, max: 1.0e-10) ?? CallendarVanDusen.C;
        var expanded = t.Quantity("expanded", Dimension.TemperatureDifference, required: true, minSi: 0.0);
        var k = t.Number("k", min: 1.0, max: 10.0) ?? 2.0;
        var certificate = t.String("certificate") ?? "certificate";
        t.RejectUnknownKeys();
        return a is null || b is null || expanded is null ? null : new RtdCertificate(a.Value, b.Value, c, expanded.Value, k, certificate);
    }
}
