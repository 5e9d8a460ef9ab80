using ModalChain.Core.Analyses.Modal;

namespace ModalChain.Io.Csv;

/// <summary>Writes a modal result as CSV: one row per mode, SI units in the header, shape columns per mass.</summary>
public static class ModesCsv
{
    /// <summary>Writes the header and one row per mode to <paramref name="writer"/>.</summary>
    public static void Write(TextWriter writer, ModalResult result)
    {
        // Line models: a column per mass (linked masses repeat their shared DOF); plane and 3d models: a column per DOF label.
        var spatial = result.Network.Space != Core.Model.ModelSpace.Line;
        var dofs = spatial ? [.. Enumerable.Range(0, result.Matrices.Size).Select(result.Matrices.Dofs.Label)] : result.Network.Masses.Select(m => m.Name).ToArray();
        writer.Write(CsvText.Row([
            "mode", "frequency [Hz]", "omega [rad/s]", "period [s]", "participation [kg^0.5]", "effective mass [kg]",
            "effective mass fraction [1]", "cumulative fraction [1]", .. dofs.Select(d => $"shape {d} [kg^-0.5]")]));
        writer.Write('\n');
        foreach (var m in result.Modes)
        {
            writer.Write(CsvText.Row([
                m.Number.ToString(System.Globalization.CultureInfo.InvariantCulture),
                CsvText.Number(m.NaturalFrequencyHz), CsvText.Number(m.AngularFrequency), CsvText.Number(m.PeriodSeconds),
                CsvText.Number(m.ParticipationFactor), CsvText.Number(m.EffectiveModalMass),
                CsvText.Number(m.EffectiveMassFraction), CsvText.Number(m.CumulativeEffectiveMassFraction),
                .. (spatial ? m.Shape : result.ShapeByMass(m)).Select(CsvText.Number)]));
            writer.Write('\n');
        }
    }
}
