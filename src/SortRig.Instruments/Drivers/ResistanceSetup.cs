namespace SortRig.Instruments.Drivers;

/// <summary>A resistance measurement setup.</summary>
/// <param name="Range">Range full scale in ohms; must be one of the profile's ranges.</param>
/// <param name="Nplc">Integration time in power-line cycles; must be one of the profile's NPLC settings.</param>
/// <param name="FourWire">True for 4-wire (Kelvin) resistance, false for 2-wire.</param>
public sealed record ResistanceSetup(double Range, double Nplc, bool FourWire);
