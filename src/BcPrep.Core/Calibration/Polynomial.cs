namespace BcPrep.Calibration;

/// <summary>Allocation-free Horner evaluation of Σ c_i·x^i (coefficients ascending) and of its derivative.</summary>
internal static class Polynomial
{
    public static double Evaluate(ReadOnlySpan<double> ascending, double x)
    {
        double sum = 0.0;
        for (int i = ascending.Length - 1; i >= 0; i--)
        {
            sum = (sum * x) + ascending[i];
        }

        return sum;
    }

    public static double Derivative(ReadOnlySpan<double> ascending, double x)
    {
        double sum = 0.0;
        for (int i = ascending.Length - 1; i >= 1; i--)
        {
            sum = (sum * x) + (i * ascending[i]);
        }

        return sum;
    }
}
