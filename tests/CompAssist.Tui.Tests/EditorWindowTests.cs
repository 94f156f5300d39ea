using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Editing;
using CompAssist.Core.Targets;
using CompAssist.Tui.Tests.Support;
using Terminal.Gui.Drawing;
using Terminal.Gui.Input;

namespace CompAssist.Tui.Tests;

public sealed class EditorWindowTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("compassist-tui-").FullName;

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private static void Close(double expected, double actual, double tolerance = 1e-9) =>
        Assert.True(Math.Abs(expected - actual) <= tolerance, $"expected {expected}, got {actual}");

    [Fact]
    public void Screen_DemoCaseAt80x24_ShowsLoopRequirementsPictureStepAndProof()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var screen = h.Screen();
        var rows = screen.Split('\n');
        Assert.EndsWith("│ F1 keys", rows[0].TrimEnd());
        Assert.Contains("G(s)  25/(s(s+5))", screen);
        Assert.Contains("OS %  10", screen);
        Assert.Contains("×", screen);
        Assert.Contains("◆", screen);
        Assert.Contains("C(s) = ", screen);
        Assert.Contains("stable ✓", screen);
        Assert.Contains("OS% ", screen);
        Assert.Contains("F1", rows[23]);
        Assert.True(h.Window.Plane.HasFocus, "a case with a design opens with the picture focused, ready for arrow keys");
    }

    [Fact]
    public void SearchKey_RunsInTheBackgroundAndOffersTheWinnerToTake()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var before = h.Session.CurrentTarget!.Value;
        h.Press(Key.F9);
        Assert.Equal(1, h.Sweeps.PendingSearches);
        Assert.Contains("Searching the region", h.Screen());

        // The search has not finished: a key still moves the target at once.
        h.Press(Key.CursorLeft);
        Assert.NotEqual(before, h.Session.CurrentTarget!.Value);

        h.Sweeps.RunSearches();
        Assert.Contains("Take one", h.Screen());
        h.Press(Key.Enter);
        var taken = h.Session.CurrentTarget!.Value;
        Assert.True(h.Session.Latest.IsSuccess);
        Assert.True(h.Session.Latest.Report!.Verdict.Meets || h.Session.Case.Variations.Length > 0, "the winner meets nominally");
        Assert.Equal(taken, h.Session.Case.Requirements.Point);

        // One undo step takes it back.
        h.Press(Key.Z.WithCtrl);
        Assert.NotEqual(taken, h.Session.CurrentTarget!.Value);
    }

    [Fact]
    public void ArrowLeft_OnThePicture_MovesTheTargetAndRedesignsAtOnce()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var before = h.Session.CurrentTarget!.Value;
        var oldDesign = h.Session.Latest.Report!.Design.Compensator.TransferFunction.ToString();
        h.Press(Key.CursorLeft);
        var after = h.Session.CurrentTarget!.Value;
        // One coarse step left, onto the step's grid (the corner itself is off the grid).
        var coarse = TargetMotion.LengthStep(h.Session.MotionScale, StepSize.Coarse);
        Assert.InRange(before.Real - after.Real, 0.5 * coarse, 1.5 * coarse);
        Close(0.0, (after.Real / coarse) - Math.Round(after.Real / coarse), 1e-9);
        Close(before.Imaginary, after.Imaginary);
        var newDesign = h.Session.Latest.Report!.Design.Compensator.TransferFunction.ToString();
        Assert.NotEqual(oldDesign, newDesign);
        var screen = h.Screen();
        Assert.Contains($"s* {Core.Model.TransferFunctionFormatter.Number(after.Real, 4)} ±", screen);
        Assert.Contains("C(s) = " + newDesign, screen);
        Assert.Contains("● unsaved", screen);
    }

    [Fact]
    public void ShiftArrow_OnThePicture_TakesOneFineStep()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var before = h.Session.CurrentTarget!.Value;
        h.Press(Key.CursorUp.WithShift);
        var after = h.Session.CurrentTarget!.Value;
        // One fine step, landing on the fine grid: between half a step and one and a half.
        var fine = TargetMotion.LengthStep(h.Session.MotionScale, StepSize.Fine);
        Assert.InRange(after.Imaginary - before.Imaginary, 0.5 * fine, 1.5 * fine);
        Assert.Equal(0.0, Math.Round(after.Imaginary / fine) - (after.Imaginary / fine), 9);
        Assert.Equal(StepSize.Coarse, h.Session.Size);
    }

    [Fact]
    public void ModeKey_ThenLeft_MovesAlongTheConstantDampingRay()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var before = h.Session.CurrentTarget!.Value;
        h.Press(Key.M, Key.CursorLeft);
        var after = h.Session.CurrentTarget!.Value;
        Close(-before.Real / before.Magnitude, -after.Real / after.Magnitude, 1e-12);
        Assert.True(after.Magnitude > before.Magnitude);
        Assert.Contains("ζ/ωn", h.Screen());
    }

    [Fact]
    public void PrefilterKey_OnThePicture_AddsThePrefilterAsOneUndoStep()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        Assert.False(h.Session.Case.Prefilter);
        h.Press(Key.G);
        Assert.True(h.Session.Case.Prefilter);
        var report = h.Session.Latest.Report!;
        // The demo lead's zero sits beside a slower closed-loop pole: the design says why there is no prefilter.
        Assert.True(report.Prefilter is not null || report.PrefilterNote is not null);
        Assert.Contains("prefilter on", h.Screen(), StringComparison.Ordinal);
        h.Press(Key.Z.WithCtrl);
        Assert.False(h.Session.Case.Prefilter);
    }

    [Fact]
    public void CtrlZ_AfterTwoMoves_UndoesOneAtATimeAndCtrlYRedoes()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var start = h.Session.CurrentTarget!.Value;
        h.Press(Key.CursorLeft);
        var middle = h.Session.CurrentTarget!.Value;
        h.Press(Key.CursorUp);
        h.Press(Key.Z.WithCtrl);
        Assert.Equal(middle, h.Session.CurrentTarget!.Value);
        h.Press(Key.Z.WithCtrl);
        Assert.Equal(start, h.Session.CurrentTarget!.Value);
        Assert.DoesNotContain("unsaved", h.Screen());
        h.Press(Key.Y.WithCtrl);
        Assert.Equal(middle, h.Session.CurrentTarget!.Value);
        Assert.Contains("redid", h.Window.Message);
    }

    [Fact]
    public void CornerKey_AfterMoves_SnapsBackToTheRequirementCorner()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var corner = TargetSelector.Select(h.Session.Case.Requirements).Value!.Target.Point;
        h.Press(Key.CursorLeft, Key.CursorLeft, Key.CursorDown, Key.C);
        Assert.Equal(corner, h.Session.CurrentTarget!.Value);
    }

    [Fact]
    public void TypedTarget_ExactPoint_IsDesignedThere()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.T);
        Assert.StartsWith("target s*", h.Window.PromptText);
        h.Press(Enumerable.Repeat(Key.Backspace, 40).ToArray());
        h.Type("-4, 5");
        h.Press(Key.Enter);
        Assert.Null(h.Window.PromptText);
        Assert.Equal(new Complex(-4, 5), h.Session.CurrentTarget!.Value);
        Assert.True(h.Session.Latest.IsSuccess);
        Assert.Contains("s* -4 ± 5j", h.Screen());
    }

    [Fact]
    public void TypedTarget_Garbage_KeepsThePromptOpenWithTheReason()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var before = h.Session.CurrentTarget;
        h.Press(Key.F5);
        h.Press(Enumerable.Repeat(Key.Backspace, 40).ToArray());
        h.Type("-4, 5q");
        h.Press(Key.Enter);
        Assert.NotNull(h.Window.PromptText);
        Assert.Contains("does not belong", h.Screen());
        Assert.Equal(before, h.Session.CurrentTarget);
        h.Press(Key.Esc);
        Assert.Null(h.Window.PromptText);
    }

    [Fact]
    public void ImpossibleTarget_ShowsWhyInPlaceAndKeepsTheLastGoodDesign()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var good = h.Session.LastGood!.Design.Compensator.TransferFunction.ToString();
        h.Press(Key.T);
        h.Press(Enumerable.Repeat(Key.Backspace, 40).ToArray());
        h.Type("1, 4");
        h.Press(Key.Enter);
        Assert.False(h.Session.Latest.IsSuccess);
        var screen = h.Screen();
        Assert.Contains("REFUSED", screen);
        Assert.Contains("last good C(s) = " + good, screen);
        Assert.Contains("✗", screen);
        Assert.Contains("◆", screen);
        h.Press(Key.Z.WithCtrl);
        Assert.True(h.Session.Latest.IsSuccess);
        Assert.DoesNotContain("REFUSED", h.Screen());
    }

    [Fact]
    public void FieldTyping_UnclosedParenthesis_ShowsTheErrorUnderTheFieldWithACaret()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Window.BoxOf(CaseField.Plant).SetFocus();
        h.Press(Enumerable.Repeat(Key.Backspace, 30).ToArray());
        h.Type("25/(s(s+5)");
        var error = h.Window.ErrorOf(CaseField.Plant);
        Assert.NotNull(error);
        var rows = h.Screen().Split('\n');
        var fieldRow = Array.FindIndex(rows, r => r.StartsWith("G(s)", StringComparison.Ordinal));
        Assert.Contains("G(s)!", rows[fieldRow]);
        var caretColumn = rows[fieldRow + 1].IndexOf('^', StringComparison.Ordinal);
        Assert.Equal(rows[fieldRow].IndexOf("25/", StringComparison.Ordinal) + error.Index, caretColumn);
        Assert.Contains(error.Message, rows[fieldRow + 2]);
        h.Type(")");
        Assert.Null(h.Window.ErrorOf(CaseField.Plant));
        Assert.Equal("25/(s(s+5))", h.Session.Case.Plant);
        Assert.DoesNotContain("^", h.Screen().Split('\n')[fieldRow + 1]);
    }

    [Fact]
    public void FieldTyping_NewRequirement_RedesignsForTheNewCorner()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Window.BoxOf(CaseField.Overshoot).SetFocus();
        h.Press(Enumerable.Repeat(Key.Backspace, 10).ToArray());
        h.Type("5");
        Assert.Equal(5.0, h.Session.Case.Requirements.MaxOvershootPercent);
        var corner = TargetSelector.Select(h.Session.Case.Requirements).Value!.Target.Point;
        Assert.Equal(corner, h.Session.CurrentTarget!.Value);
        Assert.Contains("≤ 5 ", h.Screen());
    }

    [Fact]
    public void Screen_LoopWithADelay_ShowsTheDelayAndItsPadeOrder()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder, "pump-pressure.toml"));
        Assert.Contains("Loop  delay 0.05 s, roots: Padé 3", h.Screen());
    }

    [Fact]
    public void OpenKey_WithUnsavedWork_AsksThenOpensTheOtherCase()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var other = Path.Combine(folder, "gimbal-tilt.toml");
        File.Copy(Path.Combine(Repository.Root(), "cases", "gimbal-tilt.toml"), other);
        h.Press(Key.CursorLeft, Key.O.WithCtrl);
        Assert.Contains("unsaved changes", h.Window.PromptText);
        h.Press(Key.D);
        Assert.StartsWith("open case file", h.Window.PromptText);
        h.Press(Enumerable.Repeat(Key.Backspace, 200).ToArray());
        h.Type(other);
        h.Press(Key.Enter);
        Assert.Equal(other, h.Session.Path);
        Assert.False(h.Session.IsDirty);
        Assert.Contains("gimbal-tilt.toml", h.Screen());
        Assert.Contains("opened gimbal-tilt.toml", h.Window.Message);
    }

    [Fact]
    public void OpenKey_MissingFile_SaysWhyAndKeepsAsking()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var before = h.Session.Path;
        h.Press(Key.O.WithCtrl);
        h.Press(Enumerable.Repeat(Key.Backspace, 200).ToArray());
        h.Type(Path.Combine(folder, "nothing-here.toml"));
        h.Press(Key.Enter);
        Assert.Equal(before, h.Session.Path);
        Assert.StartsWith("open case file", h.Window.PromptText);
        Assert.Contains("Cannot open", h.Screen());
    }

    [Fact]
    public void CompensatorKey_F3_SwitchesToLagAndShowsIt()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.F3);
        Assert.Equal("lag", h.Session.Case.CompensatorType);
        Assert.Contains("│ lag │", h.Screen());
        h.Press(Key.F3.WithShift);
        Assert.Equal("lead", h.Session.Case.CompensatorType);
    }

    [Fact]
    public void SaveKey_ThenReopen_RoundTripsTheMovedTarget()
    {
        var session = EditorHarness.Demo(folder);
        Complex moved;
        using (var h = new EditorHarness(session))
        {
            h.Press(Key.CursorLeft, Key.CursorUp, Key.S.WithCtrl);
            moved = h.Session.CurrentTarget!.Value;
            Assert.False(h.Session.IsDirty);
            Assert.Contains("saved belt-axis.toml", h.Window.Message);
        }

        var (reread, error) = CaseFileReader.ReadFile(Path.Combine(folder, "belt-axis.toml"));
        Assert.Null(error);
        using var again = new EditorHarness(new DesignSession(reread!, Path.Combine(folder, "belt-axis.toml"), folder));
        Assert.Equal(moved, again.Session.CurrentTarget!.Value);
        Assert.DoesNotContain("unsaved", again.Screen());
    }

    [Fact]
    public void SaveKey_NewCase_AsksForANameAndWritesThere()
    {
        using var h = new EditorHarness(new DesignSession(new CaseFile(), null, folder));
        Assert.True(h.Window.BoxOf(CaseField.Plant).HasFocus, "a new case opens in the plant field");
        h.Type("10/(s(s+2))");
        h.Window.BoxOf(CaseField.Zeta).SetFocus();
        h.Type("0.5");
        h.Window.BoxOf(CaseField.NaturalFrequency).SetFocus();
        h.Type("4");
        Assert.True(h.Session.Latest.IsSuccess);
        h.Press(Key.S.WithCtrl);
        Assert.StartsWith("save as", h.Window.PromptText);
        h.Press(Enumerable.Repeat(Key.Backspace, 200).ToArray());
        var path = Path.Combine(folder, "mine.toml");
        h.Type(path);
        h.Press(Key.Enter);
        Assert.True(File.Exists(path));
        Assert.Equal(path, h.Session.Path);
        Assert.Equal("10/(s(s+2))", CaseFileReader.ReadFile(path).Case!.Plant);
    }

    [Fact]
    public void QuitKey_WithUnsavedWork_AsksAndDiscardRemovesTheAutosave()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.CursorLeft);
        h.Window.AutosaveNow();
        var autosave = h.Session.AutosavePath;
        Assert.True(File.Exists(autosave));
        h.Press(Key.Q.WithCtrl);
        Assert.False(h.Window.QuitRequested);
        Assert.Contains("Unsaved changes", h.Window.PromptText);
        h.Press(Key.Esc);
        Assert.False(h.Window.QuitRequested);
        h.Press(Key.Q.WithCtrl);
        h.Press(Key.D);
        Assert.True(h.Window.QuitRequested);
        Assert.False(File.Exists(autosave));
    }

    [Fact]
    public void QuitKey_SaveAndQuit_WritesTheCaseThenQuits()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.CursorDown);
        var moved = h.Session.Case.Requirements.Point;
        h.Press(Key.Esc, Key.S);
        Assert.True(h.Window.QuitRequested);
        Assert.Equal(moved, CaseFileReader.ReadFile(Path.Combine(folder, "belt-axis.toml")).Case!.Requirements.Point);
    }

    [Fact]
    public void QuitKey_NothingUnsaved_QuitsAtOnce()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.Q.WithCtrl);
        Assert.True(h.Window.QuitRequested);
    }

    [Fact]
    public void Autosave_FoundWhenReopening_IsOfferedAndRestored()
    {
        Complex moved;
        using (var h = new EditorHarness(EditorHarness.Demo(folder)))
        {
            h.Press(Key.CursorLeft, Key.CursorLeft);
            moved = h.Session.CurrentTarget!.Value;
            h.Window.AutosaveNow();
        }

        // The session "dropped": the case file is unchanged, the autosave beside it holds the work.
        var path = Path.Combine(folder, "belt-axis.toml");
        var autosave = AutosaveFiles.NewerThanCase(path, folder);
        Assert.NotNull(autosave);
        using var again = new EditorHarness(new DesignSession(CaseFileReader.ReadFile(path).Case!, path, folder));
        again.Window.OfferAutosave(autosave);
        Assert.Contains("Autosaved work", again.Window.PromptText);
        again.Press(Key.R);
        Assert.Equal(moved, again.Session.CurrentTarget!.Value);
        Assert.True(again.Session.IsDirty);
    }

    [Fact]
    public void RobustnessSweep_WhileRunning_ShowsProgressAndKeysStillRedesign()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        Assert.Equal(1, h.Sweeps.Pending);
        Assert.Contains("robustness 0/4…", h.Screen());
        h.Sweeps.ReportProgress(2);
        Assert.Contains("robustness 2/4…", h.Screen());

        // The sweep has not finished; a key press still moves the target and redesigns at once.
        var before = h.Session.CurrentTarget!.Value;
        h.Press(Key.CursorLeft);
        Assert.NotEqual(before, h.Session.CurrentTarget!.Value);
        Assert.True(h.Session.Latest.IsSuccess);
        Assert.Equal(2, h.Sweeps.Started);

        // Only the sweep of the current design may land; the first one was cancelled.
        h.Sweeps.RunAll();
        Assert.Contains("robust 4/4 stable, ", h.Screen());
        Assert.Equal(h.Session.Revision, h.Session.PendingSweep?.Revision ?? h.Session.Revision);
        Assert.Null(h.Session.PendingSweep);
    }

    [Fact]
    public void RobustnessSweep_KeyThatChangesNothing_DoesNotRestartIt()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        Assert.Equal(1, h.Sweeps.Started);
        h.Press(Key.D0, Key.C);
        Assert.Equal(1, h.Sweeps.Started);
    }

    [Fact]
    public void OpenKey_WhileASweepRuns_ThatSweepNeverLandsOnTheNewCase()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        var other = Path.Combine(folder, "gimbal-tilt.toml");
        File.Copy(Path.Combine(Repository.Root(), "cases", "gimbal-tilt.toml"), other);
        h.Press(Key.O.WithCtrl);
        h.Press(Enumerable.Repeat(Key.Backspace, 200).ToArray());
        h.Type(other);
        h.Press(Key.Enter);
        Assert.Equal(other, h.Session.Path);
        h.Sweeps.RunAll();
        if (h.Session.Case.Variations.IsEmpty)
        {
            Assert.Null(h.Session.Robustness);
        }
        else
        {
            Assert.Equal(h.Session.Case.Variations, h.Session.Robustness!.Variations);
        }
    }

    [Fact]
    public void Prompts_EmptyPaths_AreAnsweredWithAReasonNotACrash()
    {
        using var h = new EditorHarness(new DesignSession(new CaseFile(), null, folder));
        h.Press(Key.O.WithCtrl);
        h.Press(Enumerable.Repeat(Key.Backspace, 200).ToArray());
        h.Press(Key.Enter);
        Assert.StartsWith("open case file", h.Window.PromptText);
        Assert.Contains("Type the path", h.Screen());
        h.Press(Key.Esc);
        h.Type("10/(s(s+2))");
        h.Press(Key.S.WithCtrl);
        h.Press(Enumerable.Repeat(Key.Backspace, 200).ToArray());
        h.Press(Key.Enter);
        Assert.StartsWith("save as", h.Window.PromptText);
        Assert.Null(h.Session.Path);
    }

    [Fact]
    public void TextPrompt_Tab_KeepsTheFocusInThePrompt()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.T, Key.Tab, Key.Tab);
        h.Press(Enumerable.Repeat(Key.Backspace, 40).ToArray());
        h.Type("-4, 5");
        Assert.Equal("25/(s(s+5))", h.Session.Case.Plant);
        h.Press(Key.Enter);
        Assert.Equal(new Complex(-4, 5), h.Session.CurrentTarget!.Value);
    }

    [Fact]
    public void SaveAs_ExistingFile_AsksBeforeOverwriting()
    {
        var existing = Path.Combine(folder, "taken.toml");
        File.WriteAllText(existing, "keep me");
        using var h = new EditorHarness(new DesignSession(new CaseFile(), null, folder));
        h.Type("10/(s(s+2))");
        h.Press(Key.S.WithCtrl);
        h.Press(Enumerable.Repeat(Key.Backspace, 200).ToArray());
        h.Type(existing);
        h.Press(Key.Enter);
        Assert.Contains("exists", h.Window.PromptText);
        h.Press(Key.Esc);
        Assert.Equal("keep me", File.ReadAllText(existing));
        Assert.Null(h.Session.Path);
    }

    [Fact]
    public void AutosaveOffer_Esc_KeepsTheOldWorkAsideAndTheTimerNeverDeletesIt()
    {
        var session = EditorHarness.Demo(folder);
        var path = session.Path!;
        var autosave = AutosaveFiles.PathFor(path, folder);
        File.WriteAllText(autosave, CaseFileWriter.Write(session.Case with { Requirements = session.Case.Requirements with { Point = new Complex(-5, 5) } }));
        using var h = new EditorHarness(session);

        // An unchanged session must not remove an autosave it did not write.
        h.Window.AutosaveNow();
        Assert.True(File.Exists(autosave));

        h.Window.OfferAutosave(autosave);
        h.Press(Key.Esc);
        Assert.False(File.Exists(autosave));
        var aside = Directory.GetFiles(folder, "belt-axis.autosave-*.toml");
        Assert.Single(aside);
        Assert.Equal(new Complex(-5, 5), CaseFileReader.ReadFile(aside[0]).Case!.Requirements.Point);
        Assert.Contains("kept as", h.Window.Message);
    }

    [Fact]
    public void ReportCrash_AnUnexpectedError_IsShownAndTheWorkAutosaved()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.CursorLeft);
        Assert.True(h.Window.ReportCrash(new InvalidOperationException("boom")));
        Assert.Contains("internal error (InvalidOperationException: boom)", h.Screen());
        Assert.True(File.Exists(h.Session.AutosavePath));
    }

    [Fact]
    public void HelpKey_ListsEveryKeyOfTheTable()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.F1);
        Assert.Equal("help", h.Window.OpenPage);
        var help = h.Window.HelpText();
        var lines = help.Split('\n');
        string? lastLabel = null;
        foreach (var k in h.Window.Keys)
        {
            if (k.Label.Length == 0)
            {
                // Listed with the key just before it in the table, which is written "x / y".
                Assert.NotNull(lastLabel);
                Assert.Contains("/", lastLabel);
                continue;
            }

            // Each labelled key has its own line: the label, then the start of what it does.
            var start = k.What.Length > 20 ? k.What[..20] : k.What;
            Assert.Contains(lines, line => line.StartsWith($"  {k.Label}", StringComparison.Ordinal) && line.Contains(start, StringComparison.Ordinal));
            lastLabel = k.Label;
        }

        Assert.All(help.Split('\n'), line => Assert.True(line.TrimEnd('\r').Length <= 80, line));
        Assert.Contains("CompAssist keys", h.Screen());
        h.Press(Key.Esc);
        Assert.Equal(string.Empty, h.Window.OpenPage);
        Assert.False(h.Window.QuitRequested);
    }

    [Fact]
    public void ReportKey_F7_ShowsTheFullProofAndScrolls()
    {
        using var h = new EditorHarness(EditorHarness.Demo(folder));
        h.Press(Key.F7);
        Assert.Equal("report", h.Window.OpenPage);
        var first = h.Screen();
        Assert.Contains("Design report", first);
        h.Press(Key.PageDown, Key.PageDown);
        Assert.NotEqual(first, h.Screen());
        h.Press(Key.End);
        var lastLine = Core.Reporting.DesignTextReport.Render(h.Session.Latest.Report!).TrimEnd().Split('\n')[^1].Trim();
        Assert.Contains(lastLine, h.Screen());
    }

    [Fact]
    public void HandoffKey_F8_ShowsTheCautionCyclesTheMethodAndWritesThroughTheWriter()
    {
        string? writtenTo = null;
        using var h = new EditorHarness(EditorHarness.Demo(folder), writer: (_, package, _, dir, _) =>
        {
            writtenTo = dir;
            Assert.NotEmpty(package.Files);
            return null;
        });
        h.Press(Key.F8);
        Assert.Equal("handoff", h.Window.OpenPage);
        var screen = h.Screen();
        Assert.Contains("CAUTION", screen);
        Assert.Contains("emergency stop", screen);
        Assert.Contains("method         tustin", screen);
        h.Press(Key.M);
        Assert.Contains("method         prewarp", h.Screen());
        Assert.Contains("delay          none", h.Screen());
        h.Press(Key.D);
        Assert.Contains("delay          one sample", h.Screen());
        Assert.Contains("(ZOH plant, 1 sample of delay)", h.Window.PageText);
        h.Press(Key.A);
        Assert.Contains("anti-windup    back-calculation", h.Window.PageText);
        h.Press(Key.W);
        Assert.StartsWith("write the package", h.Window.PromptText);
        h.Press(Key.Enter);
        Assert.Equal(Path.Combine(folder, "belt_axis-handoff"), writtenTo);
        Assert.Contains("Read its caution", h.Window.Message);
    }

    [Fact]
    public void NoColour_EveryCellUsesTheTerminalsOwnColours()
    {
        using var plain = new EditorHarness(EditorHarness.Demo(folder), noColour: true);
        plain.Screen();
        Assert.All(Cells(plain), a => Assert.True(a.Foreground == Color.None && a.Background == Color.None, a.ToString()));
        Assert.DoesNotMatch(@"\x1b\[[0-9;]*(3[0-7]|9[0-7]|4[0-7]|10[0-7]|38;|48;)[0-9;]*m", plain.Ansi());

        using var coloured = new EditorHarness(EditorHarness.Demo(folder, "gimbal-tilt.toml"));
        coloured.Screen();
        Assert.Contains(Cells(coloured), a => a.Foreground != Color.None);
    }

    private static List<Terminal.Gui.Drawing.Attribute> Cells(EditorHarness h)
    {
        var contents = h.App.Driver!.Contents!;
        var list = new List<Terminal.Gui.Drawing.Attribute>();
        for (var r = 0; r < contents.GetLength(0); r++)
        {
            for (var c = 0; c < contents.GetLength(1); c++)
            {
                if (contents[r, c].Attribute is { } a)
                {
                    list.Add(a);
                }
            }
        }

        return list;
    }

    [Fact]
    public void Screen_At120x40_UsesTheRoomForTheLargerPicture()
    {
        using var small = new EditorHarness(EditorHarness.Demo(folder));
        small.Screen();
        using var large = new EditorHarness(EditorHarness.Demo(folder, "pump-pressure.toml"), 120, 40);
        var screen = large.Screen();
        Assert.Contains("C(s) = ", screen);
        var smallRows = small.Window.PlanePicture.Split('\n').Length;
        var largeRows = large.Window.PlanePicture.Split('\n').Length;
        Assert.True(largeRows > smallRows, $"{largeRows} rows at 120×40, {smallRows} at 80×24");
    }
}
