using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Editing;
using CompAssist.Core.Model;
using CompAssist.Core.Targets;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Editing;

public sealed class DesignSessionTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("compassist-session-").FullName;

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private string CopyOfDemo(string name = "belt-axis.toml")
    {
        var path = Path.Combine(folder, name);
        File.Copy(Path.Combine(Repository.Root(), "cases", name), path);
        return path;
    }

    private DesignSession Open(string path)
    {
        var (c, error) = CaseFileReader.ReadFile(path);
        Assert.Null(error);
        return new DesignSession(c!, path, folder);
    }

    // 1 + C·G·H evaluated by products of factors at s, without any root finding.
    private static Complex ReturnDifference(Loop loop, TransferFunction c, Complex s)
    {
        static Complex Eval(TransferFunction f, Complex s)
        {
            var v = new Complex(f.Gain, 0);
            foreach (var z in f.Zeros)
            {
                v *= s - z;
            }

            foreach (var p in f.Poles)
            {
                v /= s - p;
            }

            return v;
        }

        var l = Eval(c, s) * Eval(loop.Plant, s) * Eval(loop.Feedback, s);
        return loop.Sign == FeedbackSign.Negative ? 1 + l : 1 - l;
    }

    [Fact]
    public void Constructor_DemoCase_DesignsAtTheRequirementCorner()
    {
        var session = Open(CopyOfDemo());
        Assert.True(session.Latest.IsSuccess);
        var corner = TargetSelector.Select(session.Case.Requirements).Value!.Target.Point;
        Tolerance.Close(corner, session.CurrentTarget!.Value, 1e-12);
        Assert.False(session.IsDirty);
    }

    [Fact]
    public void MoveTarget_Left_RedesignsWithAClosedLoopRootAtTheNewTarget()
    {
        var session = Open(CopyOfDemo());
        var before = session.CurrentTarget!.Value;
        Assert.True(session.MoveTarget(MoveDirection.Left));
        var after = session.CurrentTarget!.Value;
        Assert.True(after.Real < before.Real);
        Tolerance.Close(before.Imaginary, after.Imaginary, 1e-12);
        var design = session.Latest.Report!.Design;
        var rd = ReturnDifference(design.Loop, design.Compensator.TransferFunction, after);
        Assert.True(rd.Magnitude < 1e-9, $"|1 + CGH| = {rd.Magnitude} at the moved target");
        Assert.True(session.IsDirty);
    }

    [Fact]
    public void Undo_AfterTwoMoves_ReturnsStepByStepAndRedoReplays()
    {
        var session = Open(CopyOfDemo());
        var start = session.CurrentTarget!.Value;
        session.MoveTarget(MoveDirection.Left);
        var middle = session.CurrentTarget!.Value;
        session.MoveTarget(MoveDirection.Up);
        Assert.True(session.Undo());
        Tolerance.Close(middle, session.CurrentTarget!.Value, 1e-12);
        Assert.True(session.Undo());
        Tolerance.Close(start, session.CurrentTarget!.Value, 1e-12);
        Assert.False(session.IsDirty);
        Assert.False(session.Undo());
        Assert.True(session.Redo());
        Tolerance.Close(middle, session.CurrentTarget!.Value, 1e-12);
    }

    [Fact]
    public void Undo_MoreChangesThanTheDepth_KeepsTheLatestOnes()
    {
        var session = Open(CopyOfDemo());
        for (var i = 0; i < DesignSession.UndoDepth + 10; i++)
        {
            session.MoveTarget(i % 2 == 0 ? MoveDirection.Left : MoveDirection.Right);
        }

        var undone = 0;
        while (session.Undo())
        {
            undone++;
        }

        Assert.Equal(DesignSession.UndoDepth, undone);
    }

    [Fact]
    public void Edit_KeystrokesInOneField_AreOneUndoStep()
    {
        var session = Open(CopyOfDemo());
        Assert.Null(session.Edit(CaseField.Overshoot, "1"));
        Assert.Null(session.Edit(CaseField.Overshoot, "15"));
        Assert.Equal(15.0, session.Case.Requirements.MaxOvershootPercent);
        session.Undo();
        Assert.Equal(10.0, session.Case.Requirements.MaxOvershootPercent);
        Assert.False(session.CanUndo);
    }

    [Fact]
    public void Edit_BadText_LeavesTheCaseAndReturnsTheError()
    {
        var session = Open(CopyOfDemo());
        var before = CaseFileWriter.Write(session.Case);
        var error = session.Edit(CaseField.Plant, "25/(s(s+5)");
        Assert.NotNull(error);
        Assert.Equal(before, CaseFileWriter.Write(session.Case));
        Assert.False(session.CanUndo);
    }

    [Fact]
    public void Edit_Requirement_PutsAMovedTargetBackAtTheCorner()
    {
        var session = Open(CopyOfDemo());
        session.MoveTarget(MoveDirection.Left);
        session.Edit(CaseField.SettlingTime, "1.0");
        Assert.Null(session.Case.Requirements.Point);
        var corner = TargetSelector.Select(session.Case.Requirements).Value!.Target.Point;
        Tolerance.Close(corner, session.CurrentTarget!.Value, 1e-12);
    }

    [Fact]
    public void MoveTarget_IntoTheRightHalfPlane_IsRefusedAndKeepsTheLastGoodDesign()
    {
        var session = Open(CopyOfDemo());
        var good = session.LastGood;
        session.SetTarget(new Complex(0.5, 3.0));
        Assert.False(session.Latest.IsSuccess);
        Assert.Same(good, session.LastGood);
        Assert.StartsWith("refused:", session.Status);
        Tolerance.Close(0.5, session.CurrentTarget!.Value.Real, 1e-12);
        session.Undo();
        Assert.True(session.Latest.IsSuccess);
    }

    [Fact]
    public void SnapToCorner_AfterMoves_ReturnsToTheCorner()
    {
        var session = Open(CopyOfDemo());
        var corner = session.CurrentTarget!.Value;
        session.MoveTarget(MoveDirection.Left);
        session.MoveTarget(MoveDirection.Up);
        Assert.True(session.SnapToCorner());
        Tolerance.Close(corner, session.CurrentTarget!.Value, 1e-12);
        Assert.False(session.SnapToCorner());
    }

    [Fact]
    public void CycleKind_SixTimes_ComesBackAndEveryKindDesignsTheDemo()
    {
        var session = Open(CopyOfDemo());
        for (var i = 0; i < 6; i++)
        {
            session.CycleKind(1);
        }

        Assert.Equal("lead", session.Case.CompensatorType);
        session.CycleKind(-1);
        Assert.Equal("pid", session.Case.CompensatorType);
    }

    [Fact]
    public void Save_ThenReopen_GivesTheSameCaseAndTarget()
    {
        var path = CopyOfDemo();
        var session = Open(path);
        session.MoveTarget(MoveDirection.Left);
        Assert.Null(session.Save());
        Assert.False(session.IsDirty);
        var reopened = Open(path);
        Assert.Equal(CaseFileWriter.Write(session.Case), CaseFileWriter.Write(reopened.Case));
        Tolerance.Close(session.CurrentTarget!.Value, reopened.CurrentTarget!.Value, 1e-12);
    }

    [Fact]
    public void Save_InterruptedBeforeRename_LeavesTheOldFileIntact()
    {
        var path = CopyOfDemo();
        var old = File.ReadAllText(path);
        var session = Open(path);
        session.MoveTarget(MoveDirection.Left);
        var problem = session.Save(beforeRename: () => throw new IOException("connection dropped"));
        Assert.NotNull(problem);
        Assert.StartsWith("not saved", session.Status);
        Assert.Equal(old, File.ReadAllText(path));
        Assert.True(session.IsDirty);
    }

    [Fact]
    public void Autosave_WithUnsavedWork_WritesAReadableCaseBesideTheFileAndSaveRemovesIt()
    {
        var path = CopyOfDemo();
        var session = Open(path);
        session.MoveTarget(MoveDirection.Up);
        Assert.Null(session.Autosave());
        var autosave = Path.Combine(folder, "belt-axis" + AutosaveFiles.Suffix);
        Assert.Equal(autosave, session.AutosavePath);
        var (restored, error) = CaseFileReader.ReadFile(autosave);
        Assert.Null(error);
        Assert.Equal(CaseFileWriter.Write(session.Case), CaseFileWriter.Write(restored!));
        Assert.Equal(autosave, AutosaveFiles.NewerThanCase(path, folder));
        session.Save();
        Assert.False(File.Exists(autosave));
    }

    [Fact]
    public void Autosave_CleanSession_LeavesAnAutosaveItDidNotWrite()
    {
        var path = CopyOfDemo();
        var foreign = Path.Combine(folder, "belt-axis" + AutosaveFiles.Suffix);
        File.WriteAllText(foreign, "work of an earlier session");
        var session = Open(path);
        Assert.Null(session.Autosave());
        Assert.Equal("work of an earlier session", File.ReadAllText(foreign));
        session.DiscardAutosave();
        Assert.True(File.Exists(foreign));
    }

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    public void Save_NoFileName_IsRefusedWithoutWritingAnything(string name)
    {
        var session = new DesignSession(new CaseFile { Plant = "1/(s+1)" }, null, folder);
        var problem = session.Save(name);
        Assert.NotNull(problem);
        Assert.Null(session.Path);
        Assert.Empty(Directory.GetFiles(folder));
    }

    [Fact]
    public void Save_NewCase_GoesToTheGivenPathAndRemovesTheUntitledAutosave()
    {
        var session = new DesignSession(new CaseFile(), null, folder);
        Assert.False(session.IsDirty);
        Assert.False(session.Latest.IsSuccess);
        Assert.Null(session.Edit(CaseField.Plant, "10/(s(s+2))"));
        Assert.Null(session.Edit(CaseField.Zeta, "0.5"));
        Assert.Null(session.Edit(CaseField.NaturalFrequency, "4"));
        Assert.True(session.Latest.IsSuccess);
        session.Autosave();
        Assert.True(File.Exists(Path.Combine(folder, "untitled" + AutosaveFiles.Suffix)));
        var path = Path.Combine(folder, "new.toml");
        Assert.Null(session.Save(path));
        Assert.False(File.Exists(Path.Combine(folder, "untitled" + AutosaveFiles.Suffix)));
        Assert.Equal(path, session.Path);
    }

    [Fact]
    public void PendingSweep_DemoWithVariations_RunsAndAStaleResultIsIgnored()
    {
        var session = Open(CopyOfDemo());
        var request = session.PendingSweep;
        Assert.NotNull(request);
        Assert.Equal(4, request.Corners);
        var done = new List<int>();
        var result = request.Run(new SynchronousProgress(done), CancellationToken.None);
        Assert.Equal([1, 2, 3, 4], done);
        session.MoveTarget(MoveDirection.Left);
        Assert.False(session.AcceptSweep(request.Revision, result));
        Assert.Null(session.Robustness);
        var fresh = session.PendingSweep!;
        Assert.True(session.AcceptSweep(fresh.Revision, fresh.Run(null, CancellationToken.None)));
        Assert.Equal(4, session.Robustness!.Corners.Length);
        Assert.Null(session.PendingSweep);
    }

    [Fact]
    public void PendingSweep_Cancelled_Throws()
    {
        var session = Open(CopyOfDemo());
        using var cts = new CancellationTokenSource();
        cts.Cancel();
        Assert.Throws<OperationCanceledException>(() => session.PendingSweep!.Run(null, cts.Token));
    }

    private sealed class SynchronousProgress(List<int> into) : IProgress<int>
    {
        public void Report(int value) => into.Add(value);
    }
}
