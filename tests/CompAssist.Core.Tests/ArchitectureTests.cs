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

    [Fact]
    public void Core_StringLiterals_NameNoCommandLineFlag()
    {
        // Core messages name the setting ("the zero of the fixed-zero placement"); each front end says where
        // to change it. A "--" followed by a letter inside a string literal is a flag.
        var flag = new System.Text.RegularExpressions.Regex("\"[^\"\n]*--[a-z][^\"\n]*\"");
        var found = new List<string>();
        foreach (var file in Directory.GetFiles(FindSourceFolder(), "*.cs", SearchOption.AllDirectories).Where(f => !f.Contains("/obj/", StringComparison.Ordinal)))
        {
            var lines = File.ReadAllLines(file);
            for (var i = 0; i < lines.Length; i++)
            {
                if (!lines[i].TrimStart().StartsWith("//", StringComparison.Ordinal) && flag.IsMatch(lines[i]))
                {
                    found.Add($"{Path.GetFileName(file)}:{i + 1}: {lines[i].Trim()}");
                }
            }
        }

        Assert.True(found.Count == 0, string.Join(Environment.NewLine, found));
    }

    private static string FindSourceFolder() => Path.Combine(Support.Repository.Root(), "src", "CompAssist.Core");
}
