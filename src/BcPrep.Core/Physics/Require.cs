using System.Globalization;

namespace BcPrep.Physics;

/// <summary>Single place where Physics and Profiles reject inputs outside a method's validity range.</summary>
internal static class Require
{
    /// <summary>Throws unless <paramref name="value"/> is finite and within [min, max] (inclusive).</summary>
    public static double InRange(double value, double min, double max, string what, string unit, string method)
    {
        if (!double.IsFinite(value) || value < min || value > max)
        {
            throw new BcPrepDataException(string.Format(
                CultureInfo.InvariantCulture,
                "{0} = {1:R} {2} is outside the valid range [{3:R}, {4:R}] {2} of {5}.",
                what, value, unit, min, max, method));
        }

        return value;
    }

    /// <summary>Throws unless <paramref name="value"/> is finite and strictly positive.</summary>
    public static double Positive(double value, string what, string unit)
    {
        if (!double.IsFinite(value) || value <= 0.0)
        {
            throw new BcPrepDataException(string.Format(
                CultureInfo.InvariantCulture, "{0} = {1:R} {2} must be a finite positive number.", what, value, unit));
        }

        return value;
    }

    /// <summary>Throws unless <paramref name="value"/> is finite and not negative.</summary>
    public static double NonNegative(double value, string what, string unit)
    {
        if (!double.IsFinite(value) || value < 0.0)
        {
            throw new BcPrepDataException(string.Format(
                CultureInfo.InvariantCulture, "{0} = {1:R} {2} must be a finite number >= 0.", what, value, unit));
        }

        return value;
    }

    /// <summary>Throws unless <paramref name="value"/> is finite.</summary>
    public static double Finite(double value, string what, string unit)
    {
        if (!double.IsFinite(value))
        {
            throw new BcPrepDataException(string.Format(
                CultureInfo.InvariantCulture, "{0} = {1:R} {2} must be a finite number.", what, value, unit));
        }

        return value;
    }
}
