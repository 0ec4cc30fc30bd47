using System.Diagnostics.CodeAnalysis;
using Scriban.Runtime;

namespace Briefwright.Templating;

/// <summary>Adds functions that templates call by name (<c>{{ results_table }}</c>) to a template model.</summary>
public static class ModelFunctions
{
    /// <summary>Makes <paramref name="function"/> callable from templates as <paramref name="name"/>.</summary>
    [UnconditionalSuppressMessage("Trimming", "IL2026", Justification =
        "Scriban reads the delegate's method signature by reflection. Every delegate passed here targets a method of " +
        "this tool's own assemblies, which the native publish keeps whole (TrimMode partial); the published binary " +
        "is checked to write the same bytes as the managed build (bench/check-native.sh).")]
    public static void AddFunction(this ScriptObject model, string name, Delegate function) =>
        model.Import(name, function);

    /// <summary>
    /// Makes every public static method of <paramref name="type"/> callable from templates, under its snake_case name.
    /// </summary>
    [UnconditionalSuppressMessage("Trimming", "IL2026", Justification =
        "Scriban lists the type's public methods by reflection; the annotation keeps them, and the type is one of " +
        "this tool's own, which the native publish keeps whole.")]
    public static void AddFunctions(
        this ScriptObject model,
        [DynamicallyAccessedMembers(DynamicallyAccessedMemberTypes.PublicMethods)] Type type) =>
        model.Import(type);
}
