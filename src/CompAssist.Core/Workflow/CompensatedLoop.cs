using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;

namespace CompAssist.Core.Workflow;

/// <summary>A loop and a given compensator read from user input, or why they could not be.</summary>
/// <param name="Loop">The loop, on success.</param>
/// <param name="Compensator">The compensator, on success.</param>
/// <param name="FieldError">An expression that could not be read.</param>
/// <param name="Problem">Input that cannot be used as given.</param>
public sealed record CompensatedLoop(Loop? Loop, TransferFunction? Compensator, FieldError? FieldError, Problem? Problem)
{
    /// <summary>Reads the case's loop and <paramref name="compensator"/> (ideal PD/PID allowed) and checks that C·G·H is proper.</summary>
    public static CompensatedLoop Read(CaseFile input, string compensator)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(compensator);
        if (input.Plant is null)
        {
            return new(null, null, null, new Problem("No plant is given", "Give the plant G(s), e.g. 10/(s(s+2)).", Setting.Plant));
        }

        var (loop, fieldError, problem) = DesignWorkflow.BuildLoop(input.Plant, input.Feedback, input.Sign, input.PadeOrder);
        if (loop is null)
        {
            return new(null, null, fieldError, problem);
        }

        var c = ExpressionParser.Parse(compensator, requireProper: false);
        if (!c.IsSuccess)
        {
            return new(null, null, new FieldError("compensator", c.Error), null);
        }

        if (!loop.OpenLoop(c.Value).IsProper)
        {
            return new(null, null, null, new Problem(
                "The compensated loop C·G·H has more zeros than poles; its closed loop is not proper",
                "Add a filter pole to the compensator (e.g. a derivative filter)."));
        }

        return loop.WellPosednessProblem(c.Value) is { } illPosed
            ? new(null, null, null, illPosed)
            : new(loop, c.Value, null, null);
    }
}
