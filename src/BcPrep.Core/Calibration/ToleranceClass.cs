namespace BcPrep.Calibration;

/// <summary>IEC 60584-1 thermocouple tolerance classes.</summary>
public enum ThermocoupleToleranceClass
{
    Class1,
    Class2,
    Class3,
}

/// <summary>IEC 60751 platinum RTD tolerance classes (AA and C since the 2008 edition).</summary>
public enum RtdToleranceClass
{
    AA,
    A,
    B,
    C,
}

/// <summary>Construction of an RTD element; IEC 60751:2008 gives each class a different validity range for each.</summary>
public enum RtdElementKind
{
    WireWound,
    ThinFilm,
}
