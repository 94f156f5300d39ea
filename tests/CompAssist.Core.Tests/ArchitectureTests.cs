using System.Reflection;
using System.Runtime.CompilerServices;
using CompAssist.Core.Model;

namespace CompAssist.Core.Tests;

/// <summary>Rules of the code base that a reviewer would otherwise have to remember.</summary>
public class ArchitectureTests
{
    private static readonly Assembly Core = typeof(TransferFunction).Assembly;

    [Fact]
    public void Core_ReferencesNoUserInterfaceOrPlotting()
    {
        var names = Core.GetReferencedAssemblies().Select(a => a.Name ?? string.Empty).ToList();
        Assert.DoesNotContain(names, n => n.StartsWith("Terminal.Gui", StringComparison.Ordinal));
        Assert.DoesNotContain(names, n => n.StartsWith("OxyPlot", StringComparison.Ordinal));
        Assert.DoesNotContain(names, n => n == "System.Console");
    }

    [Fact]
    public void Core_PublicClasses_AreSealedOrStatic()
    {
        var open = Core.GetExportedTypes()
            .Where(t => t.IsClass && !t.IsSealed && !t.IsAbstract && !typeof(Exception).IsAssignableFrom(t))
            .Select(t => t.FullName)
            .ToList();
        Assert.Empty(open);
    }

    [Fact]
    public void Core_PublicProperties_HaveNoPublicSetters()
    {
        // Domain values are immutable: properties are get-only or init-only.
        var mutable = Core.GetExportedTypes()
            .SelectMany(t => t.GetProperties(BindingFlags.Public | BindingFlags.Instance | BindingFlags.DeclaredOnly).Select(p => (t, p)))
            .Where(x => x.p.SetMethod is { IsPublic: true } setter
                        && !setter.ReturnParameter.GetRequiredCustomModifiers().Contains(typeof(IsExternalInit)))
            .Select(x => $"{x.t.Name}.{x.p.Name}")
            .ToList();
        Assert.Empty(mutable);
    }

    [Fact]
    public void Core_PublicTypes_OnePerFile()
    {
        var root = FindSourceFolder();
        foreach (var file in Directory.GetFiles(root, "*.cs", SearchOption.AllDirectories).Where(f => !f.Contains("/obj/", StringComparison.Ordinal)))
        {
            var text = File.ReadAllText(file);
            var count = System.Text.RegularExpressions.Regex.Matches(text, @"^public (sealed |static |readonly )*(partial )?(class|record|struct|enum|interface) ", System.Text.RegularExpressions.RegexOptions.Multiline).Count;
            Assert.True(count <= 1, $"{file} declares {count} public top-level types");
        }
    }

    private static string FindSourceFolder() => Path.Combine(Support.Repository.Root(), "src", "CompAssist.Core");
}
